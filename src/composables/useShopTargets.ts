import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query'
import { computed, type Ref } from 'vue'
import * as api from '../api/targets'
import type { SetTargetBody } from '../../shared/schemas/targets'
import type { TargetMetric } from '../../shared/targets/bands'

/** A shop's own default bands and its minimum runner height, with setting them. */
export function useShopTargets(shopId: Ref<string>) {
  const client = useQueryClient()
  const list = useQuery({ queryKey: computed(() => ['shop-targets', shopId.value]), queryFn: () => api.listShopTargets(shopId.value) })
  const set = useMutation({
    mutationFn: (v: { metric: TargetMetric; body: SetTargetBody }) => api.setShopTarget(shopId.value, v.metric, v.body),
    onSuccess: () => {
      for (const key of ['shop-targets', 'blade-target-bands', 'blade-targets', 'blade-history', 'attention']) client.invalidateQueries({ queryKey: [key] })
    },
  })
  const wear = useQuery({ queryKey: computed(() => ['shop-wear', shopId.value]), queryFn: () => api.getShopWear(shopId.value) })
  const setWear = useMutation({
    mutationFn: (minRunnerHeightMm: number) => api.setShopWear(shopId.value, minRunnerHeightMm),
    onSuccess: () => {
      for (const key of ['shop-wear', 'blade-history']) client.invalidateQueries({ queryKey: [key] })
    },
  })
  return { list, set, wear, setWear }
}
