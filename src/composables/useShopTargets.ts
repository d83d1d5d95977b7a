import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query'
import { computed, type Ref } from 'vue'
import * as api from '../api/targets'
import type { SetTargetBody } from '../../shared/schemas/targets'
import type { TargetMetric } from '../../shared/targets/bands'

/** A shop's own default bands, with setting one. */
export function useShopTargets(shopId: Ref<string>) {
  const client = useQueryClient()
  const list = useQuery({ queryKey: computed(() => ['shop-targets', shopId.value]), queryFn: () => api.listShopTargets(shopId.value) })
  const set = useMutation({
    mutationFn: (v: { metric: TargetMetric; body: SetTargetBody }) => api.setShopTarget(shopId.value, v.metric, v.body),
    onSuccess: () => {
      for (const key of ['shop-targets', 'blade-target-bands', 'blade-targets', 'blade-history', 'attention']) client.invalidateQueries({ queryKey: [key] })
    },
  })
  return { list, set }
}
