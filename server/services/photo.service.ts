import { createHash } from 'node:crypto'
import sharp from 'sharp'
import type { AppContext } from '../context'
import { Analysis } from '../entities/analysis.entity'
import type { Blade } from '../entities/blade.entity'
import { Photo } from '../entities/photo.entity'
import { InvalidError, PayloadTooLargeError, UnsupportedMediaError } from '../errors'

/** Largest upload accepted, bytes: a 12–48 MP phone JPEG is 3–15 MB. */
export const MAX_UPLOAD_BYTES = 25 * 1024 * 1024
/** Largest decoded image, pixels: refuses decompression bombs before they are decoded. */
export const MAX_PIXELS = 50_000_000

const FORMATS = {
  jpeg: { contentType: 'image/jpeg', ext: 'jpg' },
  png: { contentType: 'image/png', ext: 'png' },
  webp: { contentType: 'image/webp', ext: 'webp' },
} as const
type Format = keyof typeof FORMATS

export interface PreparedPhoto {
  data: Buffer
  sha256: string
  contentType: string
  ext: string
  width: number
  height: number
}

const HEIC_MESSAGE =
  'This photo is in HEIC format, which Rockerbook cannot read. On an iPhone choose Settings → Camera → Formats → ' +
  'Most Compatible and take the photo again, or export it as JPEG, then upload the JPEG.'
const UNREADABLE_MESSAGE = 'This file is not a photo Rockerbook can read. Send a JPEG, PNG or WebP photo.'

/** Major brands of HEVC-coded HEIF files (ISO/IEC 23008-12), read from the leading `ftyp` box. */
const HEIC_BRANDS = new Set(['heic', 'heix', 'hevc', 'hevx', 'heim', 'heis'])

function isHeic(buffer: Buffer): boolean {
  return buffer.length >= 12 && buffer.toString('latin1', 4, 8) === 'ftyp' && HEIC_BRANDS.has(buffer.toString('latin1', 8, 12))
}

async function sniff(buffer: Buffer): Promise<{ format: Format; width: number; height: number; orientation: number }> {
  if (!buffer.length) throw new InvalidError('The file is empty. Choose the photo again and resend it.', undefined, 'EMPTY_FILE')
  // Checked before decoding: this build of sharp may not read HEVC at all, and the person still needs the advice.
  if (isHeic(buffer)) throw new UnsupportedMediaError(HEIC_MESSAGE)
  const meta = await sharp(buffer, { limitInputPixels: false }).metadata().catch(() => {
    throw new UnsupportedMediaError(UNREADABLE_MESSAGE)
  })
  // HEIF holds both HEIC (HEVC, the iPhone default) and AVIF; only the first gets the iPhone advice.
  if (meta.format === 'heif' && meta.compression !== 'av1') throw new UnsupportedMediaError(HEIC_MESSAGE)
  if (!meta.format || !(meta.format in FORMATS) || !meta.width || !meta.height) throw new UnsupportedMediaError(UNREADABLE_MESSAGE)
  if (meta.width * meta.height > MAX_PIXELS) {
    const mp = ((meta.width * meta.height) / 1e6).toFixed(0)
    throw new PayloadTooLargeError(
      `This image has ${mp} megapixels; Rockerbook accepts up to ${MAX_PIXELS / 1e6}. Send the photo as the camera took it.`)
  }
  return { format: meta.format as Format, width: meta.width, height: meta.height, orientation: meta.orientation ?? 1 }
}

const DAMAGED_MESSAGE = 'The photo file is incomplete or damaged. Send it again, or take a new photo.'

/**
 * Drops every APPn segment but JFIF (APP0) and the colour profile (APP2 ICC_PROFILE), and comments, from a JPEG:
 * EXIF, GPS and XMP go, the compressed image data stays byte for byte. Layout per ITU-T T.81 (JPEG) annex B.
 */
export function stripJpegMetadata(jpeg: Buffer): Buffer {
  const parts: Buffer[] = [jpeg.subarray(0, 2)]
  let i = 2
  while (i + 4 <= jpeg.length && jpeg[i] === 0xff) {
    const marker = jpeg[i + 1]
    if (marker === 0xda) break
    const end = i + 2 + jpeg.readUInt16BE(i + 2)
    const icc = marker === 0xe2 && jpeg.subarray(i + 4, i + 15).toString('latin1') === 'ICC_PROFILE'
    const metadata = (marker >= 0xe1 && marker <= 0xef && !icc) || marker === 0xfe
    if (!metadata) parts.push(jpeg.subarray(i, end))
    i = end
  }
  parts.push(jpeg.subarray(i))
  return Buffer.concat(parts)
}

/**
 * Checks what the bytes really are and decodes them fully (a truncated file fails here, not in the worker), then
 * stores them without metadata, so no location leaves the upload. An upright JPEG keeps its compressed data as
 * sent, so the engine measures the camera's own pixels; anything else is turned by its EXIF orientation and
 * re-encoded without metadata.
 */
export async function preparePhoto(buffer: Buffer): Promise<PreparedPhoto> {
  const { format, width, height, orientation } = await sniff(buffer)
  const decoder = () => sharp(buffer, { failOn: 'truncated', limitInputPixels: MAX_PIXELS })
  await decoder().raw().toBuffer().catch(() => {
    throw new InvalidError(DAMAGED_MESSAGE, undefined, 'DAMAGED_IMAGE')
  })
  if (format === 'jpeg' && orientation === 1) {
    const data = stripJpegMetadata(buffer)
    return { data, sha256: sha256(data), ...FORMATS.jpeg, width, height }
  }
  const pipeline = decoder().rotate()
  const encoded = format === 'jpeg' ? pipeline.jpeg({ quality: 95, chromaSubsampling: '4:4:4' })
    : format === 'png' ? pipeline.png() : pipeline.webp({ lossless: true })
  const { data, info } = await encoded.toBuffer({ resolveWithObject: true })
  return { data, sha256: sha256(data), ...FORMATS[format], width: info.width, height: info.height }
}

const sha256 = (data: Buffer) => createHash('sha256').update(data).digest('hex')

/** Content-addressed: the same stored bytes always land under the same key, so a retried upload writes nothing new. */
export function photoKey(photo: Pick<PreparedPhoto, 'sha256' | 'ext'>): string {
  return `photos/${photo.sha256.slice(0, 2)}/${photo.sha256}.${photo.ext}`
}

export interface UploadInput {
  blade: Blade
  buffer: Buffer
  checkBarMm?: number
  userId: string | null
}

/**
 * Stores the photo, records it with a queued analysis and enqueues `photo.analyze`. Nothing is written until the
 * photo has been fully read; if recording or enqueueing fails, what was written is removed again.
 */
export async function uploadPhoto(ctx: AppContext, input: UploadInput): Promise<{ analysisId: string }> {
  const prepared = await preparePhoto(input.buffer)
  const key = photoKey(prepared)
  const existed = await ctx.storage.exists(key)
  if (!existed) await ctx.storage.put(key, prepared.data, prepared.contentType)
  let analysisId: string | null = null
  try {
    analysisId = await ctx.db.transaction(async (tx) => {
      const photo = await tx.getRepository(Photo).save({
        bladeId: input.blade.id, storageKey: key, sha256: prepared.sha256, contentType: prepared.contentType,
        width: prepared.width, height: prepared.height, bytes: prepared.data.length, uploadedById: input.userId,
      })
      const analysis = await tx.getRepository(Analysis).save({
        bladeId: input.blade.id, photoId: photo.id, status: 'queued' as const, checkBarMm: input.checkBarMm ?? null,
        requestedById: input.userId,
      })
      return analysis.id
    })
    await ctx.queue.send('photo.analyze', { analysisId }, { singletonKey: analysisId })
    return { analysisId }
  } catch (error) {
    await undoUpload(ctx, analysisId, key, existed)
    throw error
  }
}

async function undoUpload(ctx: AppContext, analysisId: string | null, key: string, existed: boolean): Promise<void> {
  if (analysisId) {
    await ctx.db.query(`DELETE FROM photos WHERE id = (SELECT photo_id FROM analyses WHERE id = $1)`, [analysisId])
  }
  if (!existed) await removeUnreferenced(ctx, [key])
}

/** Removes stored photos that no row refers to any more (after deleting a pair, or undoing an upload). */
export async function removeUnreferenced(ctx: Pick<AppContext, 'db' | 'storage'>, keys: string[]): Promise<void> {
  for (const key of keys) {
    const [row] = await ctx.db.query(`SELECT 1 FROM photos WHERE storage_key = $1 LIMIT 1`, [key])
    if (!row) await ctx.storage.remove(key)
  }
}
