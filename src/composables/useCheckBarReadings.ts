import { ref, watch } from 'vue'

const KEY = 'rockerbook.checkBarReadings'

function load(): Record<string, number> {
  try {
    return JSON.parse(localStorage.getItem(KEY) ?? '{}') as Record<string, number>
  } catch {
    return {}
  }
}

/**
 * The ruler reading of each printed card's 100 mm check bar, by the card's printed id: asked once per card and
 * sent with every photo of it. Kept on this device.
 */
export function useCheckBarReadings() {
  const readings = ref<Record<string, number>>(load())
  watch(readings, (value) => localStorage.setItem(KEY, JSON.stringify(value)), { deep: true })
  return {
    readings,
    set: (cardId: string, mm: number) => (readings.value = { ...readings.value, [cardId]: mm }),
    forget: (cardId: string) => {
      const { [cardId]: _dropped, ...rest } = readings.value
      readings.value = rest
    },
  }
}
