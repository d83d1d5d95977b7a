import type { AttentionItem } from '../../shared/schemas/attention'
import type { ComparisonDto } from '../../shared/schemas/comparison'
import type { Baseline, BladeHistory } from '../../shared/schemas/history'
import { request } from './client'

const enc = encodeURIComponent

export const getBladeHistory = (bladeId: string) => request<BladeHistory>(`/blades/${enc(bladeId)}/history`)
export const markBaseline = (bladeId: string, analysisId: string) =>
  request<Baseline>(`/blades/${enc(bladeId)}/baseline`, { method: 'PUT', body: { analysisId } })

/** The comparisons people ask for; each names what it compares. */
export type CompareRequest =
  | { kind: 'baseline'; bladeId: string }
  | { kind: 'pair'; pairId: string }
  | { kind: 'sharpening'; sharpeningId: string }
  | { kind: 'any'; firstId: string; secondId: string }
  | { kind: 'reference'; analysisId: string }

export function getComparison(c: CompareRequest): Promise<ComparisonDto> {
  if (c.kind === 'baseline') return request(`/blades/${enc(c.bladeId)}/compare/baseline`)
  if (c.kind === 'pair') return request(`/pairs/${enc(c.pairId)}/compare`)
  if (c.kind === 'sharpening') return request(`/sharpenings/${enc(c.sharpeningId)}/compare`)
  if (c.kind === 'reference') return request(`/analyses/${enc(c.analysisId)}/compare-reference`)
  return request(`/analyses/${enc(c.firstId)}/compare/${enc(c.secondId)}`)
}

/** Download addresses (the browser fetches them with the session cookie). */
export const bladeCsvUrl = (bladeId: string) => `/api/blades/${enc(bladeId)}/history.csv`
export const skaterCsvUrl = (skaterId: string) => `/api/skaters/${enc(skaterId)}/history.csv`
export const bladeReportUrl = (bladeId: string) => `/api/blades/${enc(bladeId)}/report.pdf`
export const analysisReportUrl = (analysisId: string) => `/api/analyses/${enc(analysisId)}/report.pdf`

export const listAttention = () => request<AttentionItem[]>('/attention')
