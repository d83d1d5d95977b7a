/**
 * Writes the scale card to a file.
 *   npm run card -- --paper a4|letter --format pdf|png|json [--dpi 300] --out FILE
 */
import { writeFile } from 'node:fs/promises'
import { parseArgs } from 'node:util'
import { z } from 'zod'
import { cardDownloadQuerySchema } from '../../shared/schemas/card'
import { renderCard } from '../services/card.service'

const USAGE = 'usage: npm run card -- --paper a4|letter --format pdf|png|json [--dpi 300] --out FILE'

const argsSchema = cardDownloadQuerySchema.extend({
  out: z.string({ error: 'an output file is required' }).min(1, 'an output file is required'),
})

export type CardArgs = z.infer<typeof argsSchema>

/** Parses and checks the command line; throws an Error whose message says what is wrong and how to call it. */
export function parseCardArgs(argv: string[]): CardArgs {
  let values: Record<string, unknown>
  try {
    values = parseArgs({
      args: argv,
      options: { paper: { type: 'string' }, format: { type: 'string' }, dpi: { type: 'string' }, out: { type: 'string' } },
      strict: true,
      allowPositionals: false,
    }).values
  } catch (error) {
    throw new Error(`${(error as Error).message}\n${USAGE}`)
  }
  const parsed = argsSchema.safeParse(values)
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `  --${i.path.join('.')}: ${i.message}`)
    throw new Error(`invalid arguments:\n${problems.join('\n')}\n${USAGE}`)
  }
  if (values.dpi !== undefined && parsed.data.format !== 'png') {
    throw new Error(`--dpi applies to --format png only\n${USAGE}`)
  }
  return parsed.data
}

async function main(): Promise<void> {
  let args: CardArgs
  try {
    args = parseCardArgs(process.argv.slice(2))
  } catch (error) {
    console.error((error as Error).message)
    process.exitCode = 2
    return
  }
  const data = await renderCard(args.paper, args.format, { dpi: args.dpi })
  await writeFile(args.out, data)
  console.log(`wrote ${args.out} (${args.paper}, ${args.format}${args.format === 'png' ? `, ${args.dpi} dpi` : ''}, ${data.length} bytes)`)
}

if (import.meta.url === `file://${process.argv[1]}`) await main()
