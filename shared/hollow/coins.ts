import { coinRadiusSixteenths, sixteenthsToMm } from '../geometry/hollow'

/**
 * Round coins for checking a hollow at home: a coin stood across the runner's bottom fits the hollow when its radius
 * matches the root radius. Diameters (mm) as published by the issuing mint (REFERENCES.md). Coins that are not round
 * (Canada $1, UK 20p, 50p and £1, euro 20c) are left out: they are no radius reference.
 */

export type CoinIssuer = 'US' | 'Canada' | 'euro' | 'UK'

export interface Coin {
  id: string
  issuer: CoinIssuer
  /** Face value as printed on the coin, e.g. "25¢". */
  denomination: string
  /** Published diameter, mm. */
  diameterMm: number
  /** Who publishes the diameter. */
  source: string
}

const US = 'United States Mint, coin specifications'
const CA = 'Royal Canadian Mint specifications (via secondary copies)'
const CA_OWN = 'Royal Canadian Mint'
const EU = 'Council Regulation (EC) No 975/98'
const UK = 'The Royal Mint'

export const COINS: readonly Coin[] = [
  { id: 'us-1c', issuer: 'US', denomination: '1¢', diameterMm: 19.05, source: US },
  { id: 'us-5c', issuer: 'US', denomination: '5¢', diameterMm: 21.21, source: US },
  { id: 'us-10c', issuer: 'US', denomination: '10¢', diameterMm: 17.91, source: US },
  { id: 'us-25c', issuer: 'US', denomination: '25¢', diameterMm: 24.26, source: US },
  { id: 'us-50c', issuer: 'US', denomination: '50¢', diameterMm: 30.61, source: US },
  { id: 'us-1d', issuer: 'US', denomination: '$1', diameterMm: 26.49, source: US },
  { id: 'ca-1c', issuer: 'Canada', denomination: '1¢', diameterMm: 19.05, source: CA },
  { id: 'ca-5c', issuer: 'Canada', denomination: '5¢', diameterMm: 21.2, source: CA },
  { id: 'ca-10c', issuer: 'Canada', denomination: '10¢', diameterMm: 18.03, source: CA },
  { id: 'ca-25c', issuer: 'Canada', denomination: '25¢', diameterMm: 23.88, source: CA },
  { id: 'ca-2d', issuer: 'Canada', denomination: '$2', diameterMm: 28.0, source: CA_OWN },
  { id: 'eu-1c', issuer: 'euro', denomination: '1 cent', diameterMm: 16.25, source: EU },
  { id: 'eu-2c', issuer: 'euro', denomination: '2 cent', diameterMm: 18.75, source: EU },
  { id: 'eu-5c', issuer: 'euro', denomination: '5 cent', diameterMm: 21.25, source: EU },
  { id: 'eu-10c', issuer: 'euro', denomination: '10 cent', diameterMm: 19.75, source: EU },
  { id: 'eu-50c', issuer: 'euro', denomination: '50 cent', diameterMm: 24.25, source: EU },
  { id: 'eu-2e', issuer: 'euro', denomination: '€2', diameterMm: 25.75, source: EU },
  { id: 'uk-1p', issuer: 'UK', denomination: '1p', diameterMm: 20.3, source: UK },
  { id: 'uk-2p', issuer: 'UK', denomination: '2p', diameterMm: 25.9, source: UK },
  { id: 'uk-5p', issuer: 'UK', denomination: '5p', diameterMm: 18.0, source: UK },
  { id: 'uk-10p', issuer: 'UK', denomination: '10p', diameterMm: 24.5, source: UK },
  { id: 'uk-2l', issuer: 'UK', denomination: '£2', diameterMm: 28.4, source: UK },
]

export interface CoinCheck extends Coin {
  /** The coin's radius, mm: the root radius it fits exactly. */
  radiusMm: number
  /** The nearest whole sixteenth of an inch to that radius: the root radius it checks, as shops write it. */
  checksSixteenths: number
  /** Coin radius minus that sixteenth, mm (+ when the coin is a little flatter than the grind it checks). */
  offsetMm: number
}

/** What one coin checks: its radius, the nearest sixteenth of an inch and how far off that sixteenth it is. */
export function coinCheck(coin: Coin): CoinCheck {
  const radiusMm = coin.diameterMm / 2
  const checksSixteenths = Math.round(coinRadiusSixteenths(coin.diameterMm))
  return { ...coin, radiusMm, checksSixteenths, offsetMm: radiusMm - sixteenthsToMm(checksSixteenths) }
}

/** Every listed coin with what it checks, tightest root radius first, then by closeness to its sixteenth. */
export function coinTable(coins: readonly Coin[] = COINS): CoinCheck[] {
  return coins
    .map(coinCheck)
    .sort((a, b) => a.checksSixteenths - b.checksSixteenths || Math.abs(a.offsetMm) - Math.abs(b.offsetMm))
}

/** Coins that check a given root radius (sixteenths of an inch), closest fit first. */
export const coinsForRootRadius = (sixteenths: number, coins: readonly Coin[] = COINS): CoinCheck[] =>
  coinTable(coins).filter((c) => c.checksSixteenths === sixteenths)
