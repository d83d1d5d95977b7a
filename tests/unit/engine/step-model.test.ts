import { describe, expect, it } from 'vitest'
import { fitEdgeWithBoundary, fitEdgeWithKnownCard, levelOutsideEdge, normalCdf, normalCdfExact } from '../../../workers/engine/step-model'

/** A profile across the edge: steel S up to e, card C up to b, table T beyond, blurred by a Gaussian of sigma. */
function profile(e: number, b: number, sigma: number, levels: { S: number; C: number; T: number }, from: number, n: number, texture = 0.8): Float64Array {
  const out = new Float64Array(n)
  for (let k = 0; k < n; k++) {
    const s = from + k
    const card = e < b ? (levels.C - levels.S) * normalCdf((s - e) / sigma) + (levels.T - levels.C) * normalCdf((s - b) / sigma) : (levels.T - levels.S) * normalCdf((s - e) / sigma)
    out[k] = levels.S + card + texture * Math.sin(k * 2.3) // a little deterministic texture
  }
  return out
}

describe('edge fit with the card\u2019s bottom edge close behind', () => {
  it('matches the standard normal table', () => {
    // Standard normal CDF values as printed in statistical tables (from memory; e.g. the NIST/SEMATECH e-Handbook).
    expect(normalCdf(0)).toBeCloseTo(0.5, 7)
    expect(normalCdf(1)).toBeCloseTo(0.841345, 5)
    expect(normalCdf(-1.96)).toBeCloseTo(0.024998, 5)
  })

  it('tabulates the CDF within 3e-7 of the closed form (A&S 7.1.26) everywhere, tails included', () => {
    let worst = 0
    for (let x = -9; x <= 9; x += 0.000731) worst = Math.max(worst, Math.abs(normalCdf(x) - normalCdfExact(x)))
    expect(worst).toBeLessThan(3e-7)
    expect(normalCdf(Number.NEGATIVE_INFINITY)).toBe(0)
    expect(normalCdf(Number.POSITIVE_INFINITY)).toBe(1)
  })

  for (const gap of [0.5, 1.5, 3]) {
    it(`finds a steel edge ${gap} px in front of the card's bottom edge to a tenth of a pixel`, () => {
      const [e, sigma] = [0.3, 1.4]
      const levels = { S: 95, C: 225, T: 120 }
      const from = -20
      const p = profile(e, e + gap, sigma, levels, from, 40)
      // A guess two pixels off, as a biased gradient peak would give.
      const fit = fitEdgeWithBoundary({ profile: p, from, boundary: e + gap, sigma, guess: e - 1.5, reach: 3 })
      expect(fit).not.toBeNull()
      expect(Math.abs((fit as number) - e)).toBeLessThan(0.1)
    })
  }

  it('finds an edge past the card\u2019s bottom edge, steel against the table alone', () => {
    const p = profile(2, 0, 1.2, { S: 95, C: 225, T: 160 }, -20, 40)
    const fit = fitEdgeWithBoundary({ profile: p, from: -20, boundary: 0, sigma: 1.2, guess: 1, reach: 3 })
    expect(Math.abs((fit as number) - 2)).toBeLessThan(0.1)
  })

  it('believes a strip of card 1.5–2 px wide that differs little from the table, on a noisier profile', () => {
    // Dark steel, then card only 20–30 levels brighter than the table: one step of free blur across both puts the
    // edge half a pixel into the steel (0.47–0.58 px with the evidence a narrower strip needs).
    for (const [gap, card] of [[1.5, 140], [2, 130]]) {
      const p = profile(0, gap, 1.2, { S: 60, C: card, T: 110 }, -20, 40, 4)
      const fit = fitEdgeWithBoundary({ profile: p, from: -20, boundary: gap, sigma: 1.2, guess: 0.5, reach: 3 })
      expect(Math.abs(fit as number)).toBeLessThan(0.1)
    }
  })

  it('keeps one step where the card’s bottom edge hides just behind the steel and the step is softer than expected', () => {
    // The steel's edge 0.2 px past the card's bottom edge, its blur wider than the clear samples' median (1.2 px): a
    // strip of card with the expected blur must not be invented to split the one softer step in two (a three-level
    // fit alone put this edge 3 px into the steel).
    for (const table of [70, 160]) {
      const p = profile(0.2, 0, 2.2, { S: 123, C: 225, T: table }, -20, 40)
      const fit = fitEdgeWithBoundary({ profile: p, from: -20, boundary: 0, sigma: 1.2, guess: 0.2, reach: 3 })
      expect(Math.abs((fit as number) - 0.2)).toBeLessThan(0.1)
    }
  })
})

describe('edge fit with the strip of card at a known level', () => {
  const sigma = 1.2
  const from = -24
  // Dark steel, card darkened by the runner's shadow to 150 right beside it, a light table: a narrow strip of card.
  const levels = { S: 90, C: 150, T: 200 }
  for (const gap of [0.8, 1.5, 3]) {
    it(`places a steel edge ${gap} px in front of the card's bottom edge to a tenth of a pixel from a guess 2.5 px out`, () => {
      const e = 0.4
      const p = profile(e, e + gap, sigma, levels, from, 44)
      const fit = fitEdgeWithKnownCard({ profile: p, from, boundary: e + gap, sigma, guess: e + 2.5, reachIn: 6, reachOut: 3, cardLevel: levels.C })
      expect(fit).not.toBeNull()
      expect(Math.abs((fit as number) - e)).toBeLessThan(0.1)
    })
  }

  it('reads steel straight against the table as a plain step once the edge lies past the card', () => {
    const [e, b] = [1.2, -0.5]
    const p = profile(e, b, sigma, levels, from, 44)
    const fit = fitEdgeWithKnownCard({ profile: p, from, boundary: b, sigma, guess: e - 1, reachIn: 6, reachOut: 3, cardLevel: levels.C })
    expect(Math.abs((fit as number) - e)).toBeLessThan(0.1)
  })

  it('reads the card\u2019s level right outside a steel edge within a grey level', () => {
    const p = profile(0.3, 30, sigma, levels, from, 44, 0)
    const level = levelOutsideEdge(p, from, 1.0, sigma)
    expect(Math.abs((level as number) - levels.C)).toBeLessThan(1)
  })
})
