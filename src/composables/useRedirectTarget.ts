import { computed } from 'vue'
import { useRoute } from 'vue-router'

/** Where to go after signing in: the `redirect` query if it is a path inside the app, else Home. */
export function useRedirectTarget() {
  const route = useRoute()
  return computed(() => {
    const target = route.query.redirect
    return typeof target === 'string' && target.startsWith('/') && !target.startsWith('//') ? target : '/'
  })
}
