/** Refusal codes geometry can raise; the image engine maps them onto the analysis refusal of the same name. */
export type ProfileErrorCode = 'BLADE_NOT_FOUND' | 'BLADE_CUT_OFF'

/** Thrown when a traced edge cannot support the measurement; the message is written for people. */
export class ProfileError extends Error {
  readonly code: ProfileErrorCode

  constructor(code: ProfileErrorCode, message: string) {
    super(message)
    this.name = 'ProfileError'
    this.code = code
  }
}
