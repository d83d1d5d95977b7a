import { useQuery } from '@tanstack/vue-query'
import { listCapturedMail } from '../api/dev'

/** The development mailbox, refreshed every 5 s so a just-sent message shows up without a reload. */
export function useCapturedMail() {
  return useQuery({ queryKey: ['dev-mail'], queryFn: listCapturedMail, refetchInterval: 5_000 })
}
