import { z } from 'zod'

/** A point in the card frame: mm, origin top-left of the assembled card, x right, y down. */
const pointMm = z.tuple([z.number(), z.number()]).describe('card-frame point [x, y] in mm, origin top-left, y down')

export const paperSchema = z.enum(['a4', 'letter']).describe('paper the card is printed on, landscape')

export const cardFormatSchema = z.enum(['pdf', 'png', 'json']).describe('card download format')

/** PNG resolution limits, dots per inch: 300 prints sharply; at 600 the card is already ~53 MP (10 606 × 4 961). */
export const CARD_DPI = { min: 30, max: 600, default: 300 } as const

/** Query of a card download (and the CLI's options): which paper, which format, and the PNG's dpi. */
export const cardDownloadQuerySchema = z.object({
  paper: paperSchema,
  format: cardFormatSchema,
  dpi: z.coerce.number().int().min(CARD_DPI.min).max(CARD_DPI.max).default(CARD_DPI.default)
    .describe('PNG resolution in dots per inch; ignored for pdf and json'),
})

export const cardMarkerSchema = z.object({
  id: z.number().int().min(0).max(49).describe('DICT_4X4_50 marker id'),
  cornersMm: z.tuple([pointMm, pointMm, pointMm, pointMm])
    .describe('outer corners of the black border: top-left, top-right, bottom-right, bottom-left as printed'),
})

export const cardSheetSchema = z.object({
  index: z.union([z.literal(1), z.literal(2)]),
  offsetMm: pointMm.describe('card-frame position of the sheet\'s top-left corner when assembled'),
  widthMm: z.number().positive(),
  heightMm: z.number().positive(),
  visibleXMm: z.tuple([z.number(), z.number()]).describe('card-frame x-range of this sheet visible when assembled'),
  cutLineXMm: z.number().nullable().describe('sheet 2: x of the dashed cut line in the sheet\'s own frame, mm'),
})

const rectMm = z.object({
  xMm: z.number(), yMm: z.number(), widthMm: z.number().positive(), heightMm: z.number().positive(),
})

export const cardLayoutSchema = z.object({
  paper: paperSchema,
  cardId: z.string().regex(/^RB-[A-Z0-9]+-\d+$/).describe('printed card id'),
  widthMm: z.number().positive().describe('assembled card width, mm'),
  heightMm: z.number().positive().describe('card height, mm; y = heightMm is the table edge'),
  dictionary: z.literal('DICT_4X4_50'),
  markers: z.array(cardMarkerSchema).min(4),
  checkBar: z.object({ fromMm: pointMm, toMm: pointMm }).describe('ends of the printed 100 mm check bar'),
  bladeZone: rectMm.describe('band at the bottom of the card where the runner\'s silhouette falls, card mm'),
  markerSizeMm: z.number().positive().describe('marker side including its black border, mm'),
  joinXMm: z.number().describe('card-frame x of the join between sheet 1 and sheet 2'),
  sheets: z.tuple([cardSheetSchema, cardSheetSchema]),
  longestBladeMm: z.number().positive().describe('longest blade the card is designed for, mm'),
}).refine((c) => new Set(c.markers.map((m) => m.id)).size === c.markers.length, {
  message: 'marker ids must be unique', path: ['markers'],
}).refine((c) => c.bladeZone.yMm + c.bladeZone.heightMm <= c.heightMm + 1e-9, {
  message: 'blade zone must lie on the card', path: ['bladeZone'],
})

export type CardLayoutDto = z.infer<typeof cardLayoutSchema>
export type Paper = z.infer<typeof paperSchema>
export type CardFormat = z.infer<typeof cardFormatSchema>
export type CardDownloadQuery = z.infer<typeof cardDownloadQuerySchema>
