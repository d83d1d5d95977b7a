import type { AnalysisSummaryDto } from '../../shared/schemas/analyses'
import type { BladeDto, CreatePairBody, CreateSharpeningBody, PairDto, SharpeningDto, UpdateBladeBody } from '../../shared/schemas/blades'
import { request } from './client'

const enc = encodeURIComponent

export const listPairs = () => request<PairDto[]>('/pairs')
export const listSkaterPairs = (skaterId: string) => request<PairDto[]>(`/skaters/${enc(skaterId)}/pairs`)
export const createPair = (skaterId: string, body: CreatePairBody) =>
  request<PairDto>(`/skaters/${enc(skaterId)}/pairs`, { method: 'POST', body })
export const renamePair = (pairId: string, label: string) => request<PairDto>(`/pairs/${enc(pairId)}`, { method: 'PATCH', body: { label } })
export const deletePair = (pairId: string) => request<void>(`/pairs/${enc(pairId)}`, { method: 'DELETE' })

export const getBlade = (bladeId: string) => request<BladeDto>(`/blades/${enc(bladeId)}`)
export const updateBlade = (bladeId: string, body: UpdateBladeBody) =>
  request<BladeDto>(`/blades/${enc(bladeId)}`, { method: 'PATCH', body })
export const listBladeAnalyses = (bladeId: string) => request<AnalysisSummaryDto[]>(`/blades/${enc(bladeId)}/analyses`)

export const listSharpenings = (bladeId: string) => request<SharpeningDto[]>(`/blades/${enc(bladeId)}/sharpenings`)
export const recordSharpening = (bladeId: string, body: CreateSharpeningBody) =>
  request<SharpeningDto>(`/blades/${enc(bladeId)}/sharpenings`, { method: 'POST', body })
export const deleteSharpening = (id: string) => request<void>(`/sharpenings/${enc(id)}`, { method: 'DELETE' })
