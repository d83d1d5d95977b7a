import type { BladeTargetsDto, SetTargetBody, ShopWearSettingsDto, TargetSettingDto } from '../../shared/schemas/targets'
import type { TargetMetric } from '../../shared/targets/bands'
import { request } from './client'

const enc = encodeURIComponent

export const getBladeTargetBands = (bladeId: string) => request<BladeTargetsDto>(`/blades/${enc(bladeId)}/targets`)
export const setBladeTarget = (bladeId: string, metric: TargetMetric, body: SetTargetBody) =>
  request<TargetSettingDto>(`/blades/${enc(bladeId)}/targets/${metric}`, { method: 'PUT', body })
export const clearBladeTarget = (bladeId: string, metric: TargetMetric) =>
  request<void>(`/blades/${enc(bladeId)}/targets/${metric}`, { method: 'DELETE' })
export const setSkaterTarget = (skaterId: string, metric: TargetMetric, body: SetTargetBody) =>
  request<TargetSettingDto>(`/skaters/${enc(skaterId)}/targets/${metric}`, { method: 'PUT', body })
export const clearSkaterTarget = (skaterId: string, metric: TargetMetric) =>
  request<void>(`/skaters/${enc(skaterId)}/targets/${metric}`, { method: 'DELETE' })
export const listShopTargets = (shopId: string) => request<TargetSettingDto[]>(`/shops/${enc(shopId)}/targets`)
export const setShopTarget = (shopId: string, metric: TargetMetric, body: SetTargetBody) =>
  request<TargetSettingDto>(`/shops/${enc(shopId)}/targets/${metric}`, { method: 'PUT', body })
export const getShopWear = (shopId: string) => request<ShopWearSettingsDto>(`/shops/${enc(shopId)}/wear-settings`)
export const setShopWear = (shopId: string, minRunnerHeightMm: number) =>
  request<ShopWearSettingsDto>(`/shops/${enc(shopId)}/wear-settings`, { method: 'PUT', body: { minRunnerHeightMm } })
