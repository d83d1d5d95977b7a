import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query'
import { computed, type Ref } from 'vue'
import * as api from '../api/targets'
import type { SetTargetBody } from '../../shared/schemas/targets'
import type { TargetMetric } from '../../shared/targets/bands'

export type PreferenceScope = 'blade' | 'skater'

/** The bands that apply to a blade, and setting or clearing a preference for the blade or its skater. */
export function useBladeTargets(bladeId: Ref<string>, skaterId: Ref<string | null>) {
  const client = useQueryClient()
  const refresh = () => {
    // Targets feed the history's statuses and the Analysis page's readings ('blade-targets') too.
    for (const key of ['blade-target-bands', 'blade-targets', 'blade-history']) client.invalidateQueries({ queryKey: [key] })
  }
  const bands = useQuery({ queryKey: computed(() => ['blade-target-bands', bladeId.value]), queryFn: () => api.getBladeTargetBands(bladeId.value) })
  const set = useMutation({
    mutationFn: (v: { scope: PreferenceScope; metric: TargetMetric; body: SetTargetBody }) =>
      v.scope === 'blade' ? api.setBladeTarget(bladeId.value, v.metric, v.body) : api.setSkaterTarget(skaterId.value!, v.metric, v.body),
    onSuccess: refresh,
  })
  const clear = useMutation({
    mutationFn: (v: { scope: PreferenceScope; metric: TargetMetric }) =>
      v.scope === 'blade' ? api.clearBladeTarget(bladeId.value, v.metric) : api.clearSkaterTarget(skaterId.value!, v.metric),
    onSuccess: refresh,
  })
  return { bands, set, clear }
}
