import type { ResolvedTarget, ResolvedTargets } from '../../shared/targets/resolve'
import { request } from './client'

/** The target bands that apply to a blade (platform, shop, skater and blade layers already resolved). */
export async function getBladeTargets(bladeId: string): Promise<ResolvedTargets> {
  const dto = await request<{ targets: ResolvedTarget[] }>(`/blades/${encodeURIComponent(bladeId)}/targets`)
  return Object.fromEntries(dto.targets.map((t) => [t.metric, t])) as ResolvedTargets
}
