import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query'
import { computed, type Ref } from 'vue'
import * as api from '../api/blades'
import type { CreatePairBody, CreateSharpeningBody, UpdateBladeBody } from '../../shared/schemas/blades'

/** Every pair the signed-in person may see, with create and delete. */
export function usePairs() {
  const client = useQueryClient()
  const refresh = () => client.invalidateQueries({ queryKey: ['pairs'] })
  const list = useQuery({ queryKey: ['pairs'], queryFn: api.listPairs })
  const create = useMutation({ mutationFn: (v: { skaterId: string; body: CreatePairBody }) => api.createPair(v.skaterId, v.body), onSuccess: refresh })
  const remove = useMutation({ mutationFn: api.deletePair, onSuccess: refresh })
  return { list, create, remove }
}

/** One blade with its analyses and sharpenings. */
export function useBlade(bladeId: Ref<string>) {
  const client = useQueryClient()
  const blade = useQuery({ queryKey: computed(() => ['blade', bladeId.value]), queryFn: () => api.getBlade(bladeId.value) })
  const analyses = useQuery({ queryKey: computed(() => ['blade-analyses', bladeId.value]), queryFn: () => api.listBladeAnalyses(bladeId.value) })
  const sharpenings = useQuery({ queryKey: computed(() => ['sharpenings', bladeId.value]), queryFn: () => api.listSharpenings(bladeId.value) })
  const update = useMutation({
    mutationFn: (body: UpdateBladeBody) => api.updateBlade(bladeId.value, body),
    onSuccess: (dto) => client.setQueryData(['blade', bladeId.value], dto),
  })
  const refreshSharpenings = () => client.invalidateQueries({ queryKey: ['sharpenings', bladeId.value] })
  const record = useMutation({ mutationFn: (body: CreateSharpeningBody) => api.recordSharpening(bladeId.value, body), onSuccess: refreshSharpenings })
  const removeSharpening = useMutation({ mutationFn: api.deleteSharpening, onSuccess: refreshSharpenings })
  return { blade, analyses, sharpenings, update, record, removeSharpening }
}
