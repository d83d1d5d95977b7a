import { TARGET_METRICS, platformDefaults, type Band, type BladeFacts, type TargetMetric } from './bands'

/** Who may set a target layer, from least to most specific. Later layers win. */
export const TARGET_LAYERS = ['platform', 'shop', 'skater', 'blade'] as const
export type TargetLayer = (typeof TARGET_LAYERS)[number]

/** Who set a band and when; null for the platform's own defaults. */
export interface TargetAuthor {
  accountId: string
  /** Name shown to people; the role they set it in, when known. */
  displayName: string
  role?: string
}

/** One band set in one layer. */
export interface TargetSetting {
  band: Band
  setBy: TargetAuthor | null
  /** ISO 8601 timestamp; null for the platform's defaults. */
  setAt: string | null
  note?: string | null
}

/** The bands a layer sets; a metric the layer leaves out falls through to the layer below. */
export type TargetLayerSettings = Partial<Record<TargetMetric, TargetSetting>>

/** The band that applies to a metric, and which layer it came from. */
export interface ResolvedTarget extends TargetSetting {
  metric: TargetMetric
  layer: TargetLayer
}

export type ResolvedTargets = Record<TargetMetric, ResolvedTarget>

export interface TargetLayersInput {
  blade: BladeFacts
  shop?: TargetLayerSettings | null
  skater?: TargetLayerSettings | null
  bladePreference?: TargetLayerSettings | null
}

/**
 * Layers the target bands for one blade: platform defaults < shop defaults < skater preference < blade preference.
 * Each metric takes the band of the most specific layer that sets it, with who set it and when. The platform
 * layer applies the long-blade rule from the blade's nominal size; a band another layer sets is taken as written.
 */
export function resolveTargets(input: TargetLayersInput): ResolvedTargets {
  const defaults = platformDefaults(input.blade)
  const layers: [TargetLayer, TargetLayerSettings | null | undefined][] = [
    ['blade', input.bladePreference],
    ['skater', input.skater],
    ['shop', input.shop],
  ]
  const out = {} as ResolvedTargets
  for (const metric of TARGET_METRICS) {
    const hit = layers.find(([, settings]) => settings?.[metric])
    out[metric] = hit
      ? { metric, layer: hit[0], ...(hit[1]![metric] as TargetSetting) }
      : { metric, layer: 'platform', band: defaults[metric], setBy: null, setAt: null }
  }
  return out
}

/** True when a band is usable: at least one end, finite ends, and min ≤ max. */
export function isValidBand(band: Band): boolean {
  const finite = (v: number | null) => v === null || Number.isFinite(v)
  if (!finite(band.min) || !finite(band.max)) return false
  if (band.min === null && band.max === null) return false
  return band.min === null || band.max === null || band.min <= band.max
}
