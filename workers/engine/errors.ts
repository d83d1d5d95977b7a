/** Why the engine declined to measure a photo. Each code comes with a sentence telling the person what to do. */
export type RefusalCode = 'IMAGE_UNREADABLE' | 'CARD_NOT_FOUND' | 'BLADE_NOT_FOUND' | 'BLADE_CUT_OFF' | 'TOO_BLURRY'

const ADVICE: Record<RefusalCode, string> = {
  IMAGE_UNREADABLE:
    'We could not open this file as a photo. Upload the original JPEG, PNG or HEIC-converted image from your camera.',
  CARD_NOT_FOUND:
    'We could not find the scale card. Make sure both ends of the card, with all their square markers, are in the ' +
    'frame, flat, well lit and not covered, then take the photo again.',
  BLADE_NOT_FOUND:
    'We found the card but not the blade. Stand the skate on its blade right in front of the card, touching it, ' +
    'with the whole runner between the marker blocks, then take the photo again.',
  BLADE_CUT_OFF:
    'Part of the blade is outside the photo or past the end of the card. Step back a little so the whole blade, ' +
    'from the toe picks to the heel, sits between the marker blocks, then take the photo again.',
  TOO_BLURRY:
    'The photo is too blurry to measure the blade edge. Hold the phone steady (or rest it on something), tap to ' +
    'focus on the blade, and take the photo again in good light.',
}

/** A refusal: the photo cannot support a measurement. Carries a stable code and advice for the person. */
export class EngineRefusal extends Error {
  readonly code: RefusalCode

  /** `advice` replaces the code's general sentence when the engine knows more precisely what to change. */
  constructor(code: RefusalCode, detail?: string, advice?: string) {
    super(advice ?? ADVICE[code])
    this.name = 'EngineRefusal'
    this.code = code
    if (detail) this.detail = detail
  }

  /** Technical detail for logs, never shown to the person. */
  detail?: string
}

/** BLADE_NOT_FOUND where the runner was found but not where it meets the surface it stands on. */
export const SURFACE_ADVICE =
  'We found the card and the blade, but not where the runner meets the surface it stands on. Stand the skate on a ' +
  'plain surface clearly lighter or darker than the steel (a white sheet under dark steel, a dark cloth under bright ' +
  'steel), then take the photo again.'

/** The advice sentence for a refusal code. */
export function adviceFor(code: RefusalCode): string {
  return ADVICE[code]
}
