/**
 * Speed bench: one 12 MP synthetic photo (fixtures/synthetic), analysed repeatedly in a warm process, against the time
 * sharp takes just to decode the same JPEG to grey. Prints the ratio (target ≤ 6×) and the peak RSS (target < 1 GB).
 *   npm run bench [-- --runs 5]
 */
import { parseArgs } from 'node:util'
import { readFileSync } from 'node:fs'
import sharp from 'sharp'
import { renderScene, sampleScene } from '../../fixtures/synthetic'
import { analyzePhoto } from '../../workers/engine/analyze'

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]
}

/** Peak resident set size of this process so far, from the kernel's own accounting (VmHWM), MB. */
function peakRssMb(): number {
  const status = readFileSync('/proc/self/status', 'utf8').match(/VmHWM:\s+(\d+)\s+kB/)
  return status ? Number(status[1]) / 1024 : process.memoryUsage().rss / 1048576
}

async function timed(fn: () => Promise<unknown>): Promise<number> {
  const t = process.hrtime.bigint()
  await fn()
  return Number(process.hrtime.bigint() - t) / 1e6
}

async function main(): Promise<void> {
  const { values } = parseArgs({ options: { runs: { type: 'string', default: '5' }, seed: { type: 'string', default: '1012' } } })
  const runs = Number(values.runs)
  const photo = await renderScene(sampleScene(Number(values.seed), { resolution: '12mp' }))
  const m = photo.truth.metrics
  const options = { sizeIn: m.nominalSizeIn, discipline: m.discipline }
  const decode = () => sharp(photo.jpeg).rotate().greyscale().raw().toBuffer()
  // Warm-up: the first analysis loads OpenCV.js and compiles the hot paths.
  const first = await timed(() => analyzePhoto(photo.jpeg, options))
  await decode()
  const decodeMs: number[] = []
  const analyseMs: number[] = []
  let outcome = ''
  for (let i = 0; i < runs; i++) {
    decodeMs.push(await timed(decode))
    analyseMs.push(await timed(async () => {
      const out = await analyzePhoto(photo.jpeg, options)
      outcome = out.ok ? 'measured' : `refused ${out.error.code}`
    }))
  }
  const ratio = median(analyseMs) / median(decodeMs)
  const rss = peakRssMb()
  const lines = [
    `12 MP photo (${photo.width} × ${photo.height}, ${(photo.jpeg.length / 1e6).toFixed(1)} MB JPEG), ${runs} warm runs, ${outcome}`,
    `  first analysis (cold, loads OpenCV.js)  ${first.toFixed(0)} ms`,
    `  sharp decode to grey, median            ${median(decodeMs).toFixed(0)} ms`,
    `  analysis, median                        ${median(analyseMs).toFixed(0)} ms`,
    `  ${ratio <= 6 ? 'PASS' : 'FAIL'}  analysis / decode                ${ratio.toFixed(2)} ×  (target ≤ 6 ×)`,
    `  ${rss < 1024 ? 'PASS' : 'FAIL'}  peak RSS                         ${rss.toFixed(0)} MB  (target < 1024 MB)`,
  ]
  process.stdout.write(`${lines.join('\n')}\n`)
}

await main()
