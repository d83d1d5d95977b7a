import { readFile } from 'node:fs/promises'
import { parseArgs } from 'node:util'
import { analyzePhoto, type Discipline } from '../engine/analyze'

const USAGE =
  'usage: npm run --silent analyze -- PHOTO --json [--discipline freestyle|dance|pairs|synchro] [--size-in 9.5] ' +
  '[--check-bar-mm 100]'
const DISCIPLINES: Discipline[] = ['freestyle', 'dance', 'pairs', 'synchro']

function fail(message: string): never {
  process.stderr.write(`${message}\n${USAGE}\n`)
  process.exit(1)
}

function options() {
  const { values, positionals } = parseArgs({
    allowPositionals: true,
    options: {
      json: { type: 'boolean', default: false },
      discipline: { type: 'string', default: 'freestyle' },
      'size-in': { type: 'string', default: '9.5' },
      'check-bar-mm': { type: 'string' },
    },
  })
  if (positionals.length !== 1) fail('expected exactly one photo path')
  const discipline = values.discipline as Discipline
  if (!DISCIPLINES.includes(discipline)) fail(`unknown discipline ${values.discipline}`)
  const sizeIn = Number(values['size-in'])
  if (!(sizeIn >= 6 && sizeIn <= 14)) fail(`size in inches out of range: ${values['size-in']}`)
  const checkBarMm = values['check-bar-mm'] === undefined ? undefined : Number(values['check-bar-mm'])
  if (checkBarMm !== undefined && !(checkBarMm > 50 && checkBarMm < 150)) fail(`check bar reading out of range`)
  return { path: positionals[0], json: values.json, discipline, sizeIn, checkBarMm }
}

async function main(): Promise<void> {
  const opts = options()
  const bytes = await readFile(opts.path)
  const started = Date.now()
  const outcome = await analyzePhoto(bytes, { sizeIn: opts.sizeIn, discipline: opts.discipline, checkBarMm: opts.checkBarMm })
  process.stderr.write(`analysed ${opts.path} in ${Date.now() - started} ms\n`)
  // JSON is the only output format; --json is accepted so scripts state what they expect.
  process.stdout.write(`${JSON.stringify(outcome)}\n`)
  process.exitCode = outcome.ok ? 0 : 2
}

main().catch((err: unknown) => {
  process.stderr.write(`${err instanceof Error ? (err.stack ?? err.message) : String(err)}\n`)
  process.exit(1)
})
