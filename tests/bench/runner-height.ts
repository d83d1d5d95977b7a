/**
 * Runner-height bench: renders seeded synthetic photos, analyses each and compares the runner height at every station
 * the engine reports with the truth from the photo's construction (tests/bench/runner-height-score.ts). Prints one
 * line per photo and a summary: how often the top edge was found, the errors, and how often the ± covers the truth.
 *   npx tsx tests/bench/runner-height.ts [FROM] [TO] [12mp|3mp]
 */
import type { Resolution } from '../../fixtures/synthetic'
import { quantile } from './evaluate'
import { scoreRunnerHeight, type RunnerHeightScore } from './runner-height-score'

async function main(): Promise<void> {
  const from = Number(process.argv[2] ?? 1000)
  const to = Number(process.argv[3] ?? from + 29)
  const resolution = (process.argv[4] ?? '3mp') as Resolution
  const scores: RunnerHeightScore[] = []
  for (let seed = from; seed <= to; seed++) {
    const s = await scoreRunnerHeight(seed, resolution)
    scores.push(s)
    const errs = s.stations.filter((q) => q.trueMm !== null).map((q) => q.measuredMm - q.trueMm!)
    const off = s.stations.filter((q) => q.trueMm === null).length
    console.log(`seed ${seed}: ${s.refused ?? `${s.stations.length} stations (${off} where no top edge is), errors ${errs.map((e) => e.toFixed(2)).join(' ')}`}`)
  }
  const measured = scores.filter((s) => s.refused === null)
  const stations = measured.flatMap((s) => s.stations)
  const known = stations.filter((q) => q.trueMm !== null)
  const errs = known.map((q) => Math.abs(q.measuredMm - q.trueMm!))
  const covered = known.filter((q) => Math.abs(q.measuredMm - q.trueMm!) <= q.plusMinusMm).length
  console.log(`\n${resolution}: ${measured.length} of ${scores.length} photos measured, ${measured.filter((s) => s.stations.length).length} with runner heights`)
  console.log(`stations ${stations.length}, ${stations.length - known.length} where the true top edge is not (false)`)
  console.log(`|error| median ${quantile(errs, 0.5).toFixed(3)} mm, 90 % ${quantile(errs, 0.9).toFixed(3)} mm, max ${Math.max(...errs).toFixed(3)} mm`)
  console.log(`± covers the truth at ${((100 * covered) / Math.max(1, known.length)).toFixed(0)} % of stations (median ± ${quantile(known.map((q) => q.plusMinusMm), 0.5).toFixed(2)} mm)`)
}

main().catch((err) => {
  console.error(err)
  process.exit(1)
})
