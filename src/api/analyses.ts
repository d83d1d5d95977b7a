import type { AnalysisDto, AnnotationDto, CreateAnnotationBody, LandmarksBody } from '../../shared/schemas/analyses'
import { ApiError, request } from './client'

const enc = encodeURIComponent

export const getAnalysis = (id: string) => request<AnalysisDto>(`/analyses/${enc(id)}`)
export const moveLandmarks = (id: string, body: LandmarksBody) =>
  request<AnalysisDto>(`/analyses/${enc(id)}/landmarks`, { method: 'PUT', body })
export const restoreLandmarks = (id: string) => request<AnalysisDto>(`/analyses/${enc(id)}/landmarks`, { method: 'DELETE' })

export const listAnnotations = (id: string) => request<AnnotationDto[]>(`/analyses/${enc(id)}/annotations`)
export const createAnnotation = (id: string, body: CreateAnnotationBody) =>
  request<AnnotationDto>(`/analyses/${enc(id)}/annotations`, { method: 'POST', body })
export const replyToAnnotation = (noteId: string, text: string) =>
  request<AnnotationDto>(`/annotations/${enc(noteId)}/replies`, { method: 'POST', body: { text } })
export const resolveAnnotation = (noteId: string, resolved: boolean) =>
  request<AnnotationDto>(`/annotations/${enc(noteId)}`, { method: 'PATCH', body: { resolved } })

/**
 * Sends a photo with upload progress (fetch cannot report it), answering like `request`: the analysis id, or an
 * ApiError carrying the server's message.
 */
export function uploadPhoto(bladeId: string, file: Blob, fields: { checkBarMm?: number }, onProgress: (fraction: number) => void) {
  const form = new FormData()
  form.append('photo', file, file instanceof File ? file.name : 'photo.jpg')
  if (fields.checkBarMm !== undefined) form.append('checkBarMm', String(fields.checkBarMm))
  return new Promise<{ analysisId: string }>((resolve, reject) => {
    const xhr = new XMLHttpRequest()
    xhr.open('POST', `/api/blades/${enc(bladeId)}/photos`)
    xhr.withCredentials = true
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total)
    xhr.onerror = () => reject(new ApiError(0, 'OFFLINE', 'Rockerbook could not reach its server. Check your connection and try again.'))
    xhr.onload = () => {
      const body = (() => { try { return JSON.parse(xhr.responseText) } catch { return undefined } })()
      if (xhr.status === 202) return resolve(body)
      const error = body?.error
      reject(new ApiError(xhr.status, error?.code ?? `HTTP_${xhr.status}`, error?.message ?? `The upload failed (${xhr.status}). Try again.`))
    }
    xhr.send(form)
  })
}
