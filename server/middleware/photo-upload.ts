import type { RequestHandler } from 'express'
import multer from 'multer'
import { InvalidError, PayloadTooLargeError } from '../errors'
import { MAX_UPLOAD_BYTES } from '../services/photo.service'

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 10, fieldSize: 1024 },
}).single('photo')

const TOO_LARGE = `The photo is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MB. Send the photo as the camera took it, not a scan or an edited export.`

/**
 * Reads one multipart file field `photo` into memory (25 MB at most) and turns multer's own errors into our typed
 * ones, so a size or form problem answers 4xx with a sentence a person can act on.
 */
export const photoUpload: RequestHandler = (req, res, next) => {
  upload(req, res, (error: unknown) => {
    if (!error) {
      if (!req.file) return next(new InvalidError('Attach the photo in the form field "photo".', [{ path: 'photo', message: 'required' }], 'NO_FILE'))
      return next()
    }
    if (error instanceof multer.MulterError) {
      if (error.code === 'LIMIT_FILE_SIZE') return next(new PayloadTooLargeError(TOO_LARGE))
      return next(new InvalidError(`The upload form is not valid (${error.code}). Send one photo in the field "photo".`, undefined, 'BAD_UPLOAD'))
    }
    next(new InvalidError('The upload could not be read. Try sending the photo again.', undefined, 'BAD_UPLOAD'))
  })
}
