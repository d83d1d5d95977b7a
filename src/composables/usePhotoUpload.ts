import { ref } from 'vue'
import { uploadPhoto } from '../api/analyses'

/** One photo upload with its progress (0–1) and the server's message when it is refused. */
export function usePhotoUpload() {
  const progress = ref<number | null>(null)
  const error = ref<string | null>(null)
  async function send(bladeId: string, file: File, checkBarMm?: number): Promise<string | null> {
    error.value = null
    progress.value = 0
    try {
      const { analysisId } = await uploadPhoto(bladeId, file, { checkBarMm }, (f) => (progress.value = f))
      return analysisId
    } catch (e) {
      error.value = (e as Error).message
      return null
    } finally {
      progress.value = null
    }
  }
  return { progress, error, send }
}
