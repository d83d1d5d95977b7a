import type { AppContext } from '../context'
import { demoAccountsStep } from './demo-accounts'
import { demoBladesStep } from './demo-blades'
import { demoWearStep } from './demo-wear'

/** One step of demo data: what it creates, and the sign-ins `npm start` prints for it. */
export interface SeedStep {
  name: string
  signIns: string[]
  run(ctx: AppContext): Promise<void>
}

/** The demo scenario's steps in order. Each runs once per database, recorded in `seed_runs`. */
export const seedSteps: SeedStep[] = [demoAccountsStep, demoBladesStep, demoWearStep]

/** Runs the steps not yet recorded. A step that fails is not recorded, so the next start tries it again. */
export async function runSeeds(ctx: AppContext, steps: SeedStep[] = seedSteps): Promise<string[]> {
  const ran: string[] = []
  for (const step of steps) {
    const seen = await ctx.db.query(`SELECT 1 FROM seed_runs WHERE name = $1`, [step.name])
    if (seen.length) continue
    await step.run(ctx)
    await ctx.db.query(`INSERT INTO seed_runs (name) VALUES ($1)`, [step.name])
    ran.push(step.name)
  }
  return ran
}

export function demoSignIns(steps: SeedStep[] = seedSteps): string[] {
  return steps.flatMap((s) => s.signIns)
}
