import { cardLayout, type CardLayout, type CardSheet, type Paper, type PointMm } from './layout'
import { ASSEMBLY_STEPS, CAPTURE_STEPS, CHECK_BAR_NOTE, HANDLING_CAUTIONS, wrapText } from './wording'

/**
 * What to print on each sheet, as drawing primitives in the sheet's own frame (mm, origin top-left of the landscape
 * sheet, x right, y down). The PDF draws one page per sheet from this; the PNG draws the assembled card by placing
 * each sheet at its offset and showing only its visible strip. Grey is 0 = black … 1 = white.
 */
export type PrintItem =
  | { kind: 'marker'; id: number; xMm: number; yMm: number; sizeMm: number }
  | { kind: 'line'; from: PointMm; to: PointMm; widthMm: number; grey: number; dashMm?: [number, number] }
  | { kind: 'polygon'; points: PointMm[]; grey: number }
  | {
    kind: 'text'; text: string; xMm: number; yMm: number; sizeMm: number; grey: number; bold?: boolean
    /** Degrees counter-clockwise about (xMm, yMm) as seen on the page. */
    rotateDeg?: number
  }

export interface SheetPlan { sheet: CardSheet; items: PrintItem[] }

const INK = 0
const SOFT = 0.45

function text(t: string, x: number, y: number, size: number, extra: Partial<PrintItem & { kind: 'text' }> = {}): PrintItem {
  return { kind: 'text', text: t, xMm: x, yMm: y, sizeMm: size, grey: INK, ...extra }
}

/** Numbered steps, wrapped; continuation lines start with a space so `lines` indents them under the text. */
function numbered(steps: readonly string[], maxChars: number): string[] {
  return steps.flatMap((step, i) => wrapText(`${i + 1}. ${step}`, maxChars).map((l, k) => (k ? ` ${l}` : l)))
}

/** Lines of text; a line starting with spaces continues the item above, so it is indented instead. */
function lines(items: string[], x: number, y: number, size: number, lead: number, grey = INK): PrintItem[] {
  return items.map((t, i) => {
    const indent = t.startsWith(' ') ? size * 1.2 : 0
    return text(t.trimStart(), x + indent, y + i * lead, size, { grey })
  })
}

/** The check bar: a 0.5 mm rule with end ticks and inward-pointing arrowheads, so both ends read unambiguously. */
function checkBarItems(layout: CardLayout, dx: number): PrintItem[] {
  const [x0, y] = [layout.checkBar.fromMm[0] - dx, layout.checkBar.fromMm[1]]
  const x1 = layout.checkBar.toMm[0] - dx
  const tick = (x: number): PrintItem => ({ kind: 'line', from: [x, y - 7], to: [x, y + 7], widthMm: 0.3, grey: INK })
  const head = (x: number, dir: number): PrintItem => ({
    kind: 'polygon', grey: INK, points: [[x, y], [x + dir * 4, y - 1.6], [x + dir * 4, y + 1.6]],
  })
  return [
    tick(x0), tick(x1), head(x0, 1), head(x1, -1),
    { kind: 'line', from: [x0, y], to: [x1, y], widthMm: 0.5, grey: INK },
    text('100 mm check bar', x0, y - 10, 3.6, { bold: true }),
    ...lines(wrapText(CHECK_BAR_NOTE, 60), x0, y + 13, 3, 4.2),
  ]
}

/** Short rules that continue across the join when sheet 2 is aligned print to print, never to a paper edge. */
function registrationItems(layout: CardLayout, xJoin: number, side: 1 | -1): PrintItem[] {
  const ys = [12, Math.round(layout.bladeZone.yMm / 2), layout.bladeZone.yMm - 6]
  return ys.map((y) => ({ kind: 'line', from: [xJoin, y], to: [xJoin + side * 12, y], widthMm: 0.3, grey: INK }))
}

/** Corner ticks above the blade zone: they show where the runner goes without drawing inside the band. */
function zoneItems(layout: CardLayout, dx: number, visible: [number, number]): PrintItem[] {
  const z = layout.bladeZone
  const items: PrintItem[] = []
  for (const x of [z.xMm, z.xMm + z.widthMm]) {
    if (x < visible[0] || x > visible[1]) continue
    const inward = x === z.xMm ? 1 : -1
    items.push({ kind: 'line', from: [x - dx, z.yMm - 1.5], to: [x - dx, z.yMm - 7], widthMm: 0.3, grey: SOFT })
    items.push({ kind: 'line', from: [x - dx, z.yMm - 1.5], to: [x - dx + inward * 6, z.yMm - 1.5], widthMm: 0.3, grey: SOFT })
  }
  return items
}

function sheetOneItems(layout: CardLayout): PrintItem[] {
  const x = layout.bladeZone.xMm + 8
  const join = layout.joinXMm
  return [
    text('Rockerbook scale card', x, 18, 5, { bold: true }),
    text(layout.cardId, x, 31, 8, { bold: true }),
    ...checkBarItems(layout, 0),
    ...lines(wrapText(`Assembly: ${ASSEMBLY_STEPS.join(' ')}`, 68), x, 97, 2.9, 4.1),
    text('Sheet 1 of 2', x, layout.bladeZone.yMm - 4, 2.6, { grey: SOFT }),
    text(`Sheet 2 covers this part. ${layout.cardId}`, join + 8, 40, 3.2, { grey: SOFT }),
    { kind: 'line', from: [join, 6], to: [join, layout.bladeZone.yMm - 2], widthMm: 0.3, grey: INK },
    ...registrationItems(layout, join, -1),
    ...zoneItems(layout, 0, [0, join]),
  ]
}

function sheetTwoItems(layout: CardLayout): PrintItem[] {
  const sheet = layout.sheets[1]
  const dx = sheet.offsetMm[0]
  const cut = sheet.cutLineXMm ?? 0
  const x = cut + 16
  return [
    text('Taking the photo', x, 18, 4.2, { bold: true }),
    ...lines(numbered(CAPTURE_STEPS, 70), x, 27, 3, 4.3),
    text('Handle with care: blades are sharp', x, 60, 4.2, { bold: true }),
    ...lines(HANDLING_CAUTIONS.map((c) => `• ${c}`), x, 69, 3, 4.3),
    text(`${layout.cardId} · sheet 2 of 2`, x, layout.bladeZone.yMm - 4, 2.6, { grey: SOFT }),
    {
      kind: 'line', from: [cut, 0], to: [cut, sheet.heightMm], widthMm: 0.2, grey: INK, dashMm: [3, 2],
    },
    text('Cut here, discard this strip', cut - 4, sheet.heightMm / 2 + 40, 3, { grey: SOFT, rotateDeg: 90 }),
    ...registrationItems(layout, cut, 1),
    ...zoneItems(layout, dx, sheet.visibleXMm),
  ]
}

function markerItems(layout: CardLayout, sheet: CardSheet): PrintItem[] {
  const [lo, hi] = sheet.visibleXMm
  return layout.markers
    .filter((m) => m.cornersMm[0][0] >= lo && m.cornersMm[1][0] <= hi)
    .map((m) => ({
      kind: 'marker' as const, id: m.id, sizeMm: layout.markerSizeMm,
      xMm: m.cornersMm[0][0] - sheet.offsetMm[0], yMm: m.cornersMm[0][1] - sheet.offsetMm[1],
    }))
}

/** Everything printed on the two sheets of a card, in each sheet's own mm frame. */
export function printPlan(paper: Paper): SheetPlan[] {
  const layout = cardLayout(paper)
  const [s1, s2] = layout.sheets
  return [
    { sheet: s1, items: [...markerItems(layout, s1), ...sheetOneItems(layout)] },
    { sheet: s2, items: [...markerItems(layout, s2), ...sheetTwoItems(layout)] },
  ]
}
