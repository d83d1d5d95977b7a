/**
 * The scale card's geometry as data. All values are millimetres in the card frame: the assembled two-sheet card,
 * origin at its top-left, x to the right, y down; the table edge the card stands on is y = heightMm.
 *
 * The card is two landscape sheets: sheet 1 on the left, sheet 2 cut along its dashed line and laid over sheet 1 so
 * that its cut edge meets the join line printed on sheet 1. Every marker lies outside the x-range of the longest
 * blade (311 mm) centred in the blade zone with 15 mm spare at each end, so the boot never hides one.
 */

export type Paper = 'a4' | 'letter'
export type PointMm = [number, number]

/** One printed ArUco marker: corners in card mm, top-left, top-right, bottom-right, bottom-left as printed. */
export interface CardMarker {
  id: number
  cornersMm: [PointMm, PointMm, PointMm, PointMm]
}

/** One sheet of the print: where its own top-left lies on the assembled card and which strip of it stays visible. */
export interface CardSheet {
  index: 1 | 2
  /** Position of the sheet's top-left corner in the card frame when assembled, mm. */
  offsetMm: PointMm
  widthMm: number
  heightMm: number
  /** Card-frame x-range of this sheet that shows on the assembled card, mm. */
  visibleXMm: [number, number]
  /** Sheet 2 only: x of its dashed cut line in the sheet's own frame, mm. */
  cutLineXMm: number | null
}

export interface CardLayout {
  paper: Paper
  cardId: string
  widthMm: number
  heightMm: number
  dictionary: 'DICT_4X4_50'
  markers: CardMarker[]
  /** The 100 mm check bar's two end ticks, card mm. */
  checkBar: { fromMm: PointMm; toMm: PointMm }
  /** Band at the bottom of the card where the runner's silhouette falls, card mm. */
  bladeZone: { xMm: number; yMm: number; widthMm: number; heightMm: number }
  /** Side of every marker including its black border, mm. */
  markerSizeMm: number
  /** Card-frame x where sheet 2's cut edge meets sheet 1's join line, mm. */
  joinXMm: number
  sheets: [CardSheet, CardSheet]
  /** Length of the longest blade the card is designed for, mm (12.25 in). */
  longestBladeMm: number
}

/** Paper sizes, landscape, mm: A4 per ISO 216 (210 × 297), Letter per ASME Y14.1 (8.5 × 11 in). */
export const PAPER_SIZES_MM: Record<Paper, { widthMm: number; heightMm: number }> = {
  a4: { widthMm: 297, heightMm: 210 },
  letter: { widthMm: 279.4, heightMm: 215.9 },
}

/** Card design version, printed in the card id so a future layout gets a new id. */
export const CARD_DESIGN_VERSION = 1

const PAPER_CODE: Record<Paper, string> = { a4: 'A4', letter: 'LT' }
/** A4 and Letter use disjoint marker ids, so a photo can never pair one card's markers with the other's layout. */
const FIRST_MARKER_ID: Record<Paper, number> = { a4: 0, letter: 16 }

const MARKER_MM = 20
/** Gap between the two marker columns: 1.5 cells of white, enough for the detector to separate them. */
const COLUMN_GAP_MM = 5
const ROWS = 4
/** Side margin: clear of the ~6.4 mm unprintable edge many printers keep, so no marker border is clipped. */
const EDGE_MARGIN_MM = 8
const TOP_MARGIN_MM = 8
const BLOCK_TO_ZONE_MM = 1
/** 12.25 in (311.15 mm) rounded down, as the design brief states it. */
const LONGEST_BLADE_MM = 311
const BLADE_SPARE_MM = 15
const BLADE_ZONE_HEIGHT_MM = 75
const CHECK_BAR_MM = 100

const BLOCK_WIDTH_MM = 2 * MARKER_MM + COLUMN_GAP_MM
const CLEAR_SPAN_MM = LONGEST_BLADE_MM + 2 * BLADE_SPARE_MM
const CARD_WIDTH_MM = 2 * (EDGE_MARGIN_MM + BLOCK_WIDTH_MM + BLOCK_TO_ZONE_MM) + CLEAR_SPAN_MM

/** Row pitch rounded down to 0.5 mm, so marker edges fall on whole pixels of a 12 px/mm raster. */
function rowPitchMm(heightMm: number): number {
  const span = heightMm - 2 * TOP_MARGIN_MM - MARKER_MM
  return Math.floor((span / (ROWS - 1)) * 2) / 2
}

function square(x: number, y: number, size: number): CardMarker['cornersMm'] {
  return [[x, y], [x + size, y], [x + size, y + size], [x, y + size]]
}

function markerBlocks(paper: Paper, heightMm: number): CardMarker[] {
  const pitch = rowPitchMm(heightMm)
  const leftX = EDGE_MARGIN_MM
  const rightX = CARD_WIDTH_MM - EDGE_MARGIN_MM - BLOCK_WIDTH_MM
  const markers: CardMarker[] = []
  for (const [block, blockX] of [leftX, rightX].entries()) {
    for (let row = 0; row < ROWS; row++) {
      for (let col = 0; col < 2; col++) {
        const id = FIRST_MARKER_ID[paper] + block * ROWS * 2 + row * 2 + col
        const x = blockX + col * (MARKER_MM + COLUMN_GAP_MM)
        markers.push({ id, cornersMm: square(x, TOP_MARGIN_MM + row * pitch, MARKER_MM) })
      }
    }
  }
  return markers
}

/** Rounds to a micrometre so derived positions print as the decimals they are (169.6, not 169.60000000000002). */
const micro = (mm: number) => Math.round(mm * 1000) / 1000

function sheets(paper: Paper, joinXMm: number): [CardSheet, CardSheet] {
  const { widthMm, heightMm } = PAPER_SIZES_MM[paper]
  const sheet2X = micro(CARD_WIDTH_MM - widthMm)
  return [
    { index: 1, offsetMm: [0, 0], widthMm, heightMm, visibleXMm: [0, joinXMm], cutLineXMm: null },
    {
      index: 2, offsetMm: [sheet2X, 0], widthMm, heightMm,
      visibleXMm: [joinXMm, CARD_WIDTH_MM], cutLineXMm: micro(joinXMm - sheet2X),
    },
  ]
}

/**
 * The scale card for one paper size, in card-frame mm (origin top-left of the assembled card, x right, y down).
 * Pure and deterministic: the PDF, the PNG, the JSON and the synthetic photo generator all read this one layout.
 */
export function cardLayout(paper: Paper): CardLayout {
  const { heightMm } = PAPER_SIZES_MM[paper]
  const zoneX = EDGE_MARGIN_MM + BLOCK_WIDTH_MM + BLOCK_TO_ZONE_MM
  const joinXMm = CARD_WIDTH_MM / 2
  const checkBarX = zoneX + 20
  const checkBarY = 62
  return {
    paper,
    cardId: `RB-${PAPER_CODE[paper]}-${CARD_DESIGN_VERSION}`,
    widthMm: CARD_WIDTH_MM,
    heightMm,
    dictionary: 'DICT_4X4_50',
    markers: markerBlocks(paper, heightMm),
    checkBar: { fromMm: [checkBarX, checkBarY], toMm: [checkBarX + CHECK_BAR_MM, checkBarY] },
    bladeZone: {
      xMm: zoneX, yMm: heightMm - BLADE_ZONE_HEIGHT_MM, widthMm: CLEAR_SPAN_MM, heightMm: BLADE_ZONE_HEIGHT_MM,
    },
    markerSizeMm: MARKER_MM,
    joinXMm,
    sheets: sheets(paper, joinXMm),
    longestBladeMm: LONGEST_BLADE_MM,
  }
}
