import type TestAgent from 'supertest/lib/agent'
import { analysisSchema, type AnalysisDto } from '../../shared/schemas/analyses'

/** Polls the analysis until it reaches one of `statuses`, as the browser does. */
export async function waitForAnalysis(client: TestAgent, id: string, statuses: string[], timeoutMs = 120_000): Promise<AnalysisDto> {
  const until = Date.now() + timeoutMs
  for (;;) {
    const res = await client.get(`/api/analyses/${id}`).expect(200)
    const analysis = analysisSchema.parse(res.body)
    if (statuses.includes(analysis.status)) return analysis
    if (Date.now() > until) throw new Error(`analysis still ${analysis.status} after ${timeoutMs} ms`)
    await new Promise((r) => setTimeout(r, 500))
  }
}
