import type { AppContext } from '../context'
import { Blade } from '../entities/blade.entity'
import type { AuthUser } from '../middleware/require-auth'
import { listAccessibleSkaterIds } from './access.service'
import { bladeHistory } from './history.service'
import type { AttentionItem } from '../../shared/schemas/attention'
import { readAnalysis, readPair } from '../../shared/targets/readings'
import { attentionFor } from '../../shared/wear/attention'

type Ctx = Pick<AppContext, 'db'>
type Loaded = { blade: Blade } & Awaited<ReturnType<typeof bladeHistory>>

const DAY_MS = 86_400_000

function itemFor(x: Loaded, other: Loaded | undefined, now: number): AttentionItem | null {
  const { blade, history, analyses, resolved, names } = x
  const latest = analyses[analyses.length - 1]
  const otherLatest = other?.analyses[other.analyses.length - 1]
  const [left, right] = blade.side === 'left' ? [latest, otherLatest] : [otherLatest, latest]
  const lastSharpening = history.sharpenings[history.sharpenings.length - 1]
  const { level, reasons } = attentionFor({
    latest: latest ? readAnalysis(latest.result, resolved) : [],
    wearState: history.wear.state,
    projections: history.projections,
    pair: left && right ? readPair(left.result, right.result, resolved) : [],
    hockeyGrind: lastSharpening?.hockeyGrind ?? false,
    daysSinceMeasured: latest ? (now - latest.queuedAt.getTime()) / DAY_MS : null,
  })
  if (level === 0) return null
  return {
    bladeId: blade.id, pairId: blade.pairId, skaterId: blade.skaterProfileId, skater: names.skater, pair: names.pair,
    side: blade.side, level, reasons, lastMeasuredAt: latest ? latest.queuedAt.toISOString() : null,
  }
}

/**
 * The blades in use of every skater the caller can see that need attention, most urgent first: what the coach's
 * roster and the technician's bench open with. Blades never measured count too (they need a first photo).
 */
export async function attentionList(ctx: Ctx, user: AuthUser, now = Date.now()): Promise<AttentionItem[]> {
  const skaterIds = await listAccessibleSkaterIds(ctx, user)
  if (!skaterIds.length) return []
  const blades = await ctx.db.getRepository(Blade).createQueryBuilder('b')
    .where('b.skater_profile_id IN (:...ids)', { ids: skaterIds }).andWhere(`b.status = 'in_use'`).getMany()
  const loaded: Loaded[] = []
  for (const blade of blades) loaded.push({ blade, ...(await bladeHistory(ctx, blade, user)) })
  const items = loaded
    .map((x) => itemFor(x, loaded.find((y) => y.blade.pairId === x.blade.pairId && y.blade.id !== x.blade.id), now))
    .filter((i): i is AttentionItem => i !== null)
  // Most urgent level first; within a level, the blade with more reasons is further from right.
  return items.sort((a, b) => b.level - a.level || b.reasons.length - a.reasons.length || a.skater.localeCompare(b.skater) || a.side.localeCompare(b.side))
}
