import { computed, ref } from 'vue'
import { coinsForRootRadius } from '../../shared/hollow/coins'
import { RUNNER_WIDTH_DEFAULT_MM, hollowDepthFromSixteenths } from '../../shared/hollow/depth'
import { isHockeyGrind, platformDefaults } from '../../shared/targets/bands'

/** State of the hollow-depth calculator: root radius in sixteenths of an inch and runner width in mm. */
export function useHollowCalculator(initialSixteenths = 7) {
  const sixteenths = ref<number | null>(initialSixteenths)
  const widthMm = ref<number | null>(RUNNER_WIDTH_DEFAULT_MM)

  const result = computed(() => {
    if (sixteenths.value === null || widthMm.value === null) return null
    try {
      return hollowDepthFromSixteenths(sixteenths.value, widthMm.value)
    } catch {
      return null
    }
  })
  const hockey = computed(() => sixteenths.value !== null && isHockeyGrind(sixteenths.value))
  const coins = computed(() => (sixteenths.value === null ? [] : coinsForRootRadius(sixteenths.value)))
  // The root-radius band does not depend on blade size; any size gives the platform default.
  const band = platformDefaults({ sizeIn: 9 }).rootRadiusSixteenths

  return { sixteenths, widthMm, result, hockey, coins, band }
}
