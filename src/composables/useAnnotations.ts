import { useMutation, useQuery, useQueryClient } from '@tanstack/vue-query'
import { computed, type Ref } from 'vue'
import * as api from '../api/analyses'
import type { CreateAnnotationBody } from '../../shared/schemas/analyses'

/** Notes on one analysis: list, add, reply, resolve; every change refreshes the list. */
export function useAnnotations(analysisId: Ref<string>) {
  const client = useQueryClient()
  const key = computed(() => ['annotations', analysisId.value])
  const list = useQuery({ queryKey: key, queryFn: () => api.listAnnotations(analysisId.value) })
  const refresh = () => client.invalidateQueries({ queryKey: key.value })
  const add = useMutation({ mutationFn: (body: CreateAnnotationBody) => api.createAnnotation(analysisId.value, body), onSuccess: refresh })
  const reply = useMutation({ mutationFn: (v: { id: string; text: string }) => api.replyToAnnotation(v.id, v.text), onSuccess: refresh })
  const resolve = useMutation({ mutationFn: (v: { id: string; resolved: boolean }) => api.resolveAnnotation(v.id, v.resolved), onSuccess: refresh })
  return { list, add, reply, resolve }
}
