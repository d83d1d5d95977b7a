import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query'
import { computed, type Ref } from 'vue'
import * as api from '../api/history'

/** A blade's history with wear projections, and marking its reference analysis. */
export function useBladeHistory(bladeId: Ref<string>) {
  const client = useQueryClient()
  const history = useQuery({ queryKey: computed(() => ['blade-history', bladeId.value]), queryFn: () => api.getBladeHistory(bladeId.value) })
  const mark = useMutation({
    mutationFn: (analysisId: string) => api.markBaseline(bladeId.value, analysisId),
    onSuccess: () => client.invalidateQueries({ queryKey: ['blade-history', bladeId.value] }),
  })
  return { history, mark }
}

/** One comparison, fetched when its request is known. */
export function useComparison(req: Ref<api.CompareRequest | null>) {
  return useQuery({
    queryKey: computed(() => ['comparison', req.value]),
    queryFn: () => api.getComparison(req.value!),
    enabled: computed(() => req.value !== null),
    retry: false,
  })
}
