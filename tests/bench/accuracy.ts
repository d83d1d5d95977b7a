/**
 * Accuracy bench: renders seeded synthetic photos (fixtures/synthetic), analyses each with the engine and compares the
 * metrics with the truth from each photo's construction. Prints a table per resolution with PASS/FAIL per bar, the
 * refusal cases and the repeatability of one blade over five camera poses. Uses two child processes (two cores).
 *   npm run bench:accuracy [-- --count 60] [--scores FILE]   (photos per resolution, default 60, so 120 in all;
 *   --scores also writes every photo's errors and ± as JSON, for calibrating the uncertainty model)
 */
import { fork } from 'node:child_process'
import { writeFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { parseArgs } from 'node:util'
import {
  EXPECTED_REFUSAL, posesOfOneBlade, quantile, refusalCode, scorePhoto, type PhotoScore,
} from './evaluate'
import type { Refusal, Resolution } from '../../fixtures/synthetic'

type Job = { kind: 'photo'; seed: number; resolution: Resolution } | { kind: 'refusal'; seed: number; refusal: Refusal }
  | { kind: 'pose'; seed: number; index: number }
type Outcome = { job: Job; score?: PhotoScore; code?: string; error?: string }

const POSE_SEED = 4242
const POSES = 5

async function runJob(job: Job): Promise<Outcome> {
  try {
    if (job.kind === 'photo') return { job, score: await scorePhoto(job.seed, job.resolution) }
    if (job.kind === 'refusal') return { job, code: await refusalCode(job.seed, job.refusal) }
    const scene = posesOfOneBlade(POSE_SEED, POSES, '12mp')[job.index]
    return { job, score: await scorePhoto(POSE_SEED, '12mp', scene) }
  } catch (err) {
    return { job, error: err instanceof Error ? err.message : String(err) }
  }
}

function jobsFor(count: number): Job[] {
  const jobs: Job[] = []
  for (const resolution of ['12mp', '3mp'] as const)
    for (let i = 0; i < count; i++) jobs.push({ kind: 'photo', seed: 1000 + i, resolution })
  for (const refusal of Object.keys(EXPECTED_REFUSAL) as Refusal[])
    for (const seed of [11, 12]) jobs.push({ kind: 'refusal', seed, refusal })
  for (let index = 0; index < POSES; index++) jobs.push({ kind: 'pose', seed: POSE_SEED, index })
  return jobs
}

function runAll(jobs: Job[], threads: number): Promise<Outcome[]> {
  const shares: Job[][] = Array.from({ length: threads }, () => [])
  jobs.forEach((job, i) => shares[i % threads].push(job))
  const outcomes: Outcome[] = []
  return new Promise((resolve, reject) => {
    let running = threads
    for (const share of shares) {
      const worker = fork(fileURLToPath(import.meta.url), ['--worker', JSON.stringify(share)], { execArgv: ['--import', 'tsx'] })
      worker.on('message', (o: Outcome) => {
        outcomes.push(o)
        process.stderr.write(`\r${outcomes.length}/${jobs.length}`)
      })
      worker.on('error', reject)
      worker.on('exit', () => {
        if (--running === 0) resolve(outcomes)
      })
    }
  })
}

const fmt = (v: number, digits = 2) => (Number.isFinite(v) ? v.toFixed(digits) : 'n/a')

function bar(label: string, value: number, limit: number, unit: string, atLeast = false): string {
  const pass = Number.isFinite(value) && (atLeast ? value >= limit : value <= limit)
  return `  ${pass ? 'PASS' : 'FAIL'}  ${label.padEnd(44)} ${fmt(value, unit === '%' ? 1 : 2).padStart(8)} ${unit}  (bar ${atLeast ? '≥' : '≤'} ${limit} ${unit})`
}

function table(resolution: Resolution, scores: PhotoScore[]): string[] {
  const k = resolution === '12mp' ? 1 : 2
  const ok = scores.filter((s) => s.refused === null)
  const abs = (xs: number[]) => xs.map(Math.abs)
  const tp = abs(ok.map((s) => s.touchErrMm))
  const hl = abs(ok.map((s) => s.heelErrMm))
  const radius = ok.flatMap((s) => s.radiusRelErrs)
  const sections = ok.flatMap((s) => s.sectionRelErrs)
  const tpIn = ok.filter((s) => Math.abs(s.touchErrMm) <= s.touchPlusMinusMm).length / Math.max(1, ok.length)
  const hlIn = ok.filter((s) => Math.abs(s.heelErrMm) <= s.heelPlusMinusMm).length / Math.max(1, ok.length)
  const station = ok.filter((s) => s.stationErrMm !== null)
  const refused = scores.filter((s) => s.refused !== null)
  return [
    `${resolution.toUpperCase()}: ${scores.length} photos, ${ok.length} measured, ${refused.length} refused ` +
      `(${[...new Set(refused.map((s) => s.refused))].join(', ') || 'none'}); median analysis ${fmt(quantile(ok.map((s) => s.analyseMs), 0.5), 0)} ms`,
    bar('touch point |error| median', quantile(tp, 0.5), 1.0 * k, 'mm'),
    bar('touch point |error| p95', quantile(tp, 0.95), 3.0 * k, 'mm'),
    bar('heel lift |error| median', quantile(hl, 0.5), 0.3 * k, 'mm'),
    bar('heel lift |error| p95', quantile(hl, 0.95), 1.0 * k, 'mm'),
    bar('radius profile relative error median', 100 * quantile(radius, 0.5), 5, '%'),
    bar('section radii relative error median', 100 * quantile(sections, 0.5), 3, '%'),
    bar('touch point truth inside ±', 100 * tpIn, 90, '%', true),
    bar('heel lift truth inside ±', 100 * hlIn, 90, '%', true),
    bar('photos measured (not refused)', (100 * ok.length) / Math.max(1, scores.length), 90, '%', true),
    `        radius p95 ${fmt(100 * quantile(radius, 0.95), 1)} %, sections p95 ${fmt(100 * quantile(sections, 0.95), 1)} %; ` +
      `heel station (extrapolated, ${station.length} photos) |error| median ${fmt(quantile(abs(station.map((s) => s.stationErrMm!)), 0.5))} mm`,
  ]
}

function repeatability(scores: PhotoScore[]): string[] {
  const ok = scores.filter((s) => s.refused === null)
  const sd = (xs: number[]) => {
    const v = xs.filter(Number.isFinite)
    const m = v.reduce((a, b) => a + b, 0) / v.length
    return Math.sqrt(v.reduce((a, b) => a + (b - m) ** 2, 0) / Math.max(1, v.length - 1))
  }
  return [
    `Repeatability, one blade from ${scores.length} poses at 12 MP (${ok.length} measured): standard deviation of ` +
      `touch point ${fmt(sd(ok.map((s) => s.values.touch)))} mm, heel lift ${fmt(sd(ok.map((s) => s.values.heel)))} mm, ` +
      `middle radius ${fmt(sd(ok.map((s) => s.values.middle ?? NaN)), 0)} mm`,
  ]
}

async function main(): Promise<void> {
  const { values } = parseArgs({
    options: { count: { type: 'string', default: '60' }, scores: { type: 'string' } }, allowPositionals: true,
  })
  const started = Date.now()
  const outcomes = await runAll(jobsFor(Number(values.count)), 2)
  process.stderr.write('\n')
  const lines: string[] = []
  for (const resolution of ['12mp', '3mp'] as const) {
    const scores = outcomes.filter((o) => o.job.kind === 'photo' && o.job.resolution === resolution && o.score).map((o) => o.score!)
    lines.push(...table(resolution, scores), '')
  }
  lines.push('Refusals (3 MP):')
  for (const o of outcomes.filter((x) => x.job.kind === 'refusal')) {
    const job = o.job as Extract<Job, { kind: 'refusal' }>
    const want = EXPECTED_REFUSAL[job.refusal as keyof typeof EXPECTED_REFUSAL]
    lines.push(`  ${o.code === want ? 'PASS' : 'FAIL'}  ${job.refusal.padEnd(14)} seed ${job.seed}: ${o.code ?? o.error} (want ${want})`)
  }
  lines.push('', ...repeatability(outcomes.filter((o) => o.job.kind === 'pose' && o.score).map((o) => o.score!)))
  const errors = outcomes.filter((o) => o.error)
  if (errors.length) lines.push('', `Crashed: ${errors.map((o) => `${JSON.stringify(o.job)} ${o.error}`).join('; ')}`)
  if (values.scores) writeFileSync(values.scores, JSON.stringify(outcomes.filter((o) => o.score).map((o) => o.score), null, 1))
  lines.push('', `${outcomes.length} jobs in ${((Date.now() - started) / 1000).toFixed(0)} s`)
  process.stdout.write(`${lines.join('\n')}\n`)
}

const workerAt = process.argv.indexOf('--worker')
if (workerAt >= 0) {
  const jobs = JSON.parse(process.argv[workerAt + 1]) as Job[]
  for (const job of jobs) {
    const outcome = await runJob(job)
    await new Promise((done) => process.send!(outcome, done))
  }
  process.disconnect()
} else {
  await main()
}
