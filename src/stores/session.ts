import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import type { Me, Role, SignInBody, SignUpBody } from '../../shared/schemas/auth'
import * as auth from '../api/auth'
import { hasDevMailbox } from '../api/dev'

/** The signed-in person and their roles. Loaded once per page load; sign-in, sign-up and sign-out update it. */
export const useSessionStore = defineStore('session', () => {
  const user = ref<Me | null>(null)
  const loaded = ref(false)
  const devMailbox = ref(false)
  let loading: Promise<void> | null = null

  const roles = computed<Role[]>(() => user.value?.roles ?? [])
  const isSignedIn = computed(() => user.value !== null)

  function hasRole(...wanted: Role[]): boolean {
    return wanted.some((r) => roles.value.includes(r))
  }

  /** Loads the session once (or again with `force`); the router guard awaits it before every protected page. */
  function load(force = false): Promise<void> {
    if (loaded.value && !force) return Promise.resolve()
    loading ??= Promise.all([auth.getMe(), hasDevMailbox()])
      .then(([me, mailbox]) => {
        user.value = me
        devMailbox.value = mailbox
        loaded.value = true
      })
      .finally(() => (loading = null))
    return loading
  }

  async function signIn(body: SignInBody): Promise<void> {
    user.value = await auth.signIn(body)
  }

  async function signUp(body: SignUpBody): Promise<void> {
    user.value = await auth.signUp(body)
  }

  async function signOut(): Promise<void> {
    await auth.signOut()
    user.value = null
  }

  async function resendVerification(): Promise<void> {
    await auth.resendVerification()
  }

  return { user, roles, isSignedIn, loaded, devMailbox, hasRole, load, signIn, signUp, signOut, resendVerification }
})
