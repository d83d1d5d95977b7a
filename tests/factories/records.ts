import type TestAgent from 'supertest/lib/agent'

/** A skater profile owned by the signed-in client, with one pair of blades; returns their ids. */
export async function skaterWithPair(client: TestAgent, options: { sizeIn?: number; discipline?: string } = {}) {
  const skater = await client.post('/api/skaters').send({ name: 'Test Skater' }).expect(201)
  const pair = await client
    .post(`/api/skaters/${skater.body.id}/pairs`)
    .send({ label: 'Competition skates', sizeIn: options.sizeIn ?? 9.5, discipline: options.discipline ?? 'freestyle' })
    .expect(201)
  const blade = (side: 'left' | 'right') => pair.body.blades.find((b: { side: string }) => b.side === side).id as string
  return { skaterId: skater.body.id as string, pairId: pair.body.id as string, leftId: blade('left'), rightId: blade('right') }
}
