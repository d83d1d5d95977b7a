import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query'
import { computed, type Ref } from 'vue'
import * as api from '../api/analyses'
import type { AnalysisDto, LandmarksBody } from '../../shared/schemas/analyses'

const WAITING = new Set(['queued', 'running'])

/** One analysis, polled every second while it is queued or running, with landmark moves and restore. */
export function useAnalysis(id: Ref<string>) {
  const client = useQueryClient()
  const key = computed(() => ['analysis', id.value])
  const query = useQuery({
    queryKey: key,
    queryFn: () => api.getAnalysis(id.value),
    refetchInterval: (q) => (q.state.data && WAITING.has(q.state.data.status) ? 1000 : false),
  })
  const store = (dto: AnalysisDto) => client.setQueryData(key.value, dto)
  const move = useMutation({ mutationFn: (body: LandmarksBody) => api.moveLandmarks(id.value, body), onSuccess: store })
  const restore = useMutation({ mutationFn: () => api.restoreLandmarks(id.value), onSuccess: store })
  return { query, analysis: query.data, move, restore }
}
