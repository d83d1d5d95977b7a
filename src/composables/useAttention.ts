import { useQuery } from '@tanstack/vue-query'
import type { Ref } from 'vue'
import { listAttention } from '../api/history'

/** Blades the signed-in person can see that need attention, most urgent first; fetched only while `enabled`. */
export function useAttention(enabled: Ref<boolean>) {
  return useQuery({ queryKey: ['attention'], queryFn: listAttention, enabled })
}
