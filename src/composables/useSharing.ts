import { useQuery, useQueryClient } from '@tanstack/vue-query'
import { computed } from 'vue'
import { acceptShare, endShare, inviteCoach, listShares, shareWithShop } from '../api/sharing'
import { listShops } from '../api/shops'
import { listSkaters } from '../api/skaters'
import { useSessionStore } from '../stores/session'

/** The Sharing page's data: shares split by side, the caller's own skaters, the shop directory, and the actions. */
export function useSharing() {
  const session = useSessionStore()
  const queryClient = useQueryClient()
  const shares = useQuery({ queryKey: ['shares'], queryFn: listShares })
  const skaters = useQuery({ queryKey: ['skaters'], queryFn: listSkaters })
  const shops = useQuery({ queryKey: ['shops'], queryFn: listShops })

  const owned = computed(() => (skaters.data.value ?? []).filter((s) => s.via.includes('owner')))
  const ownedIds = computed(() => new Set(owned.value.map((s) => s.id)))
  const all = computed(() => shares.data.value ?? [])
  const outgoing = computed(() => all.value.filter((s) => ownedIds.value.has(s.skaterId)))
  const invitations = computed(() =>
    all.value.filter((s) => !ownedIds.value.has(s.skaterId) && s.kind === 'coach' && s.status === 'pending' && s.coachEmail === session.user?.email),
  )
  const incoming = computed(() => all.value.filter((s) => !ownedIds.value.has(s.skaterId) && s.status === 'active'))

  /** Runs an action, then refetches everything a share changes. */
  function thenRefresh<A extends unknown[]>(action: (...args: A) => Promise<unknown>) {
    return async (...args: A) => {
      await action(...args)
      await Promise.all(['shares', 'skaters', 'roster'].map((key) => queryClient.invalidateQueries({ queryKey: [key] })))
    }
  }

  return {
    isPending: computed(() => shares.isPending.value || skaters.isPending.value),
    error: computed(() => shares.error.value ?? skaters.error.value),
    owned,
    shops: computed(() => shops.data.value ?? []),
    outgoing,
    invitations,
    incoming,
    inviteCoach: thenRefresh(inviteCoach),
    shareWithShop: thenRefresh(shareWithShop),
    accept: thenRefresh(acceptShare),
    end: thenRefresh(endShare),
  }
}
