import { z } from 'zod'

/** A point in card-frame millimetres: origin top-left of the card, x right, y down (the ice side is +y). */
export const cardPointSchema = z
  .tuple([z.number(), z.number()])
  .describe('Card-frame point [x, y] in mm: origin top-left of the card, x right, y down')

const plusMinus = (what: string) => z.number().nonnegative().describe(`± of ${what}, mm (about 95 % coverage)`)

export const landmarkSchema = z
  .object({
    alongMm: z.number().describe('Blade-frame x: mm along the support line L from the base pick B toward the heel'),
    cardMm: cardPointSchema,
  })
  .describe('A landmark in both frames')

export const radiusStationSchema = z.object({
  alongMm: z.number().describe('Centre of the 40 mm fit window, mm along L from B'),
  curvaturePerMm: z
    .number()
    .describe('Signed curvature, 1/mm: positive where the edge bulges toward the ice (a normal rocker)'),
  radiusMm: z
    .number()
    .positive()
    .nullable()
    .describe('1/|curvature| in mm; null where |curvature| < 1e-5 /mm (straight to measurement precision)'),
})

export const flatSpotSchema = z.object({
  fromAlongMm: z.number().describe('Start of the flat run, mm along L from B'),
  toAlongMm: z.number().describe('End of the flat run, mm along L from B'),
  radiusMm: z.number().positive().nullable().describe('Radius fitted over the run, mm; null when straight'),
})

export const kinkSchema = z.object({
  alongMm: z.number().describe('Where the direction changes, mm along L from B'),
  angleDeg: z.number().describe('Signed change of direction beyond the fitted trend within 2 mm, degrees'),
})

export const uncertaintySchema = z
  .object({
    touchPointMm: plusMinus('the touch point'),
    heelLiftMm: plusMinus('the heel lift at E'),
    heelLiftStationMm: plusMinus('the heel lift at the heel station').nullable(),
    contactLengthMm: plusMinus('the contact length'),
    radiusRelative: z.number().nonnegative().describe('± of a 40 mm window radius as a fraction of the radius'),
  })
  .describe('Uncertainty of each metric')

export const runnerHeightStationSchema = z.object({
  alongMm: z.number().describe('Station, mm along L from B'),
  heightMm: z.number().describe('Runner height: from the running surface up to the runner\u2019s top edge, perpendicular to L, mm'),
  plusMinusMm: plusMinus('the runner height'),
})

export const topEdgeSchema = z
  .object({
    cardMm: z
      .array(z.array(cardPointSchema))
      .describe('Stretches of the runner\u2019s top edge where it shows (between the mounting plates, and the tail), card mm'),
    sigmaMm: z.number().nonnegative().describe('1σ location error of a top-edge point, mm (its scatter or the systematic floor)'),
  })
  .describe('The runner\u2019s top edge as traced: what sharpening does not touch, for runner height and registration')

export const warningSchema = z.object({
  code: z.string().describe('Stable machine-readable code, e.g. LENGTH_MISMATCH'),
  message: z.string().describe('Plain-language explanation for people'),
})

export const overridesSchema = z
  .object({
    basePickAlongMm: z.number().optional().describe('Where a person put B, mm along the detected L from the detected B'),
    heelEndAlongMm: z.number().optional().describe('Where a person put E, mm along the detected L from the detected B'),
  })
  .describe('Landmarks moved by a person; metrics are recomputed from the stored edge')

/** 3×3 row-major homography mapping card mm → photo px. */
export const homographySchema = z
  .array(z.array(z.number()).length(3))
  .length(3)
  .describe('3×3 row-major homography mapping card-frame mm to photo pixels')

export const analysisResultSchema = z.object({
  algorithmVersion: z.string().describe('Version of the measurement algorithm that produced this result'),
  touchPointMm: z.number().describe('Touch point T behind the base pick B along L, mm'),
  heelLiftMm: z.number().describe('Height of the heel end E above L, mm'),
  heelLiftStationMm: z
    .number()
    .nullable()
    .describe('Height above L at the heel station (nominal length − 45 mm behind B), mm; null when E reaches it'),
  heelLiftExtrapolated: z.boolean().describe('True when heelLiftStationMm was extrapolated along a circle'),
  contactLengthMm: z.number().describe('Chord over which the rocker at T stays within 2 µm of L, mm'),
  bladeLengthMm: z.number().describe('Extent of the traced edge along L, mm'),
  uncertainty: uncertaintySchema,
  radiusProfile: z.array(radiusStationSchema).describe('Rocker radius every 5 mm from the rocker start to E'),
  sectionRadii: z
    .object({
      toeMm: z.number().nullable().describe('Rocker start to T + 20 mm'),
      middleMm: z.number().nullable().describe('T + 20 mm to T + 100 mm'),
      heelMm: z.number().nullable().describe('T + 100 mm to E'),
    })
    .describe('Radius of one circle fitted over each section, mm; null when straight or too short'),
  flatSpots: z.array(flatSpotSchema).describe('Runs of 10 mm or more with radius over 10 m'),
  kinks: z.array(kinkSchema).describe('Direction changes over 1° within 2 mm beyond the fitted trend'),
  landmarks: z.object({ basePick: landmarkSchema, touchPoint: landmarkSchema, heelEnd: landmarkSchema }),
  edge: z
    .object({
      cardMm: z.array(cardPointSchema).describe('Traced bottom edge from the toe-pick tips to the heel end'),
      homography: homographySchema,
    })
    .describe('Stored edge, so overlays can be drawn and metrics recomputed'),
  topEdge: topEdgeSchema
    .nullable()
    .optional()
    .describe('Null when the top edge does not show in the photo; absent in results of engine versions before it was traced'),
  runnerHeights: z
    .array(runnerHeightStationSchema)
    .nullable()
    .optional()
    .describe('Runner height every 10 mm along L between the rocker start and E, where the top edge shows; null when it shows nowhere there'),
  card: z.object({
    cardId: z.string().describe('Printed id of the scale card'),
    residualMm: z.number().nonnegative().describe('RMS marker reprojection residual, card mm'),
    residualPx: z.number().nonnegative().describe('RMS marker reprojection residual, photo px'),
    checkBarMm: z.number().positive().nullable().describe('Ruler reading of the 100 mm check bar, mm; null if not entered'),
  }),
  quality: z.object({
    edgeResidualMm: z.number().nonnegative().describe('RMS residual of the edge about its local fits, mm'),
    sharpness: z.number().nonnegative().describe('Edge sharpness score, 0 (blurred) upward'),
    coverage: z.number().min(0).max(1).describe('Fraction of the blade length the edge covers'),
  }),
  warnings: z.array(warningSchema),
  overrides: overridesSchema.nullable(),
})

export const refusalCodeSchema = z.enum([
  'CARD_NOT_FOUND',
  'BLADE_NOT_FOUND',
  'BLADE_CUT_OFF',
  'TOO_BLURRY',
  'IMAGE_UNREADABLE',
])

export const analysisRefusalSchema = z
  .object({ code: refusalCodeSchema, message: z.string().describe('Plain-language reason for people') })
  .describe('Why a photo could not be measured')

export type CardPoint = z.infer<typeof cardPointSchema>
export type Landmark = z.infer<typeof landmarkSchema>
export type RadiusStation = z.infer<typeof radiusStationSchema>
export type FlatSpot = z.infer<typeof flatSpotSchema>
export type Kink = z.infer<typeof kinkSchema>
export type Uncertainty = z.infer<typeof uncertaintySchema>
export type RunnerHeightStationDto = z.infer<typeof runnerHeightStationSchema>
export type TopEdge = z.infer<typeof topEdgeSchema>
export type AnalysisWarning = z.infer<typeof warningSchema>
export type Overrides = z.infer<typeof overridesSchema>
export type AnalysisResult = z.infer<typeof analysisResultSchema>
export type RefusalCode = z.infer<typeof refusalCodeSchema>
export type AnalysisRefusal = z.infer<typeof analysisRefusalSchema>
