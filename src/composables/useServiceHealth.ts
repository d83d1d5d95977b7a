import { useQuery } from '@tanstack/vue-query'
import { getHealth } from '../api/health'

/** Service status for the home page, refreshed every 15 s. */
export function useServiceHealth() {
  return useQuery({ queryKey: ['health'], queryFn: getHealth, refetchInterval: 15_000 })
}
