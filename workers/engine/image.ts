import sharp from 'sharp'
import { EngineRefusal } from './errors'

/** An 8-bit greyscale image, row-major, in photo pixels (x right, y down). */
export interface GreyImage {
  data: Uint8Array
  width: number
  height: number
}

/** Decodes a photo to full-resolution greyscale with its EXIF orientation applied. */
export async function decodeGrey(bytes: Buffer): Promise<GreyImage> {
  try {
    const { data, info } = await sharp(bytes, { failOn: 'error', limitInputPixels: 80_000_000 })
      .rotate()
      .greyscale()
      .raw()
      .toBuffer({ resolveWithObject: true })
    if (info.channels !== 1) throw new Error(`expected 1 channel, got ${info.channels}`)
    return { data: new Uint8Array(data.buffer, data.byteOffset, data.length), width: info.width, height: info.height }
  } catch (err) {
    throw new EngineRefusal('IMAGE_UNREADABLE', err instanceof Error ? err.message : String(err))
  }
}

/** Any row-major raster of numbers: an image, or a field computed per pixel. */
export interface Raster {
  data: ArrayLike<number>
  width: number
  height: number
}

/** Bilinear sample at a sub-pixel position (pixel centres at integers); NaN outside the raster. */
export function sample(img: Raster, x: number, y: number): number {
  const x0 = Math.floor(x)
  const y0 = Math.floor(y)
  if (x0 < 0 || y0 < 0 || x0 >= img.width - 1 || y0 >= img.height - 1) return NaN
  const fx = x - x0
  const fy = y - y0
  const i = y0 * img.width + x0
  const d = img.data
  const top = d[i] + (d[i + 1] - d[i]) * fx
  const bottom = d[i + img.width] + (d[i + img.width + 1] - d[i + img.width]) * fx
  return top + (bottom - top) * fy
}

/**
 * Position of the extremum of a sampled profile, refined with a three-point parabola around the best sample.
 * Returns the fractional index and the peak value, or null if the best sample sits on the profile's end.
 */
export function peakIndex(values: ArrayLike<number>, sign: 1 | -1): { at: number; value: number } | null {
  let best = -1
  let bestValue = -Infinity
  for (let i = 0; i < values.length; i++) {
    const v = sign * values[i]
    if (v > bestValue) {
      bestValue = v
      best = i
    }
  }
  if (best <= 0 || best >= values.length - 1 || !Number.isFinite(bestValue)) return null
  const a = sign * values[best - 1]
  const c = sign * values[best + 1]
  const denom = a - 2 * bestValue + c
  const offset = denom < 0 ? (0.5 * (a - c)) / denom : 0
  return { at: best + offset, value: sign * (bestValue - 0.25 * (a - c) * offset) }
}

/**
 * Like {@link peakIndex}, but fits the parabola to the logarithm of the three samples when all are positive: exact
 * for the Gaussian gradient profile of a blurred step, where a plain parabola is biased by up to 1/6 px.
 */
export function gaussianPeak(values: ArrayLike<number>, sign: 1 | -1): { at: number; value: number } | null {
  const peak = peakIndex(values, sign)
  if (!peak) return null
  const i = Math.round(peak.at)
  const [a, b, c] = [sign * values[i - 1], sign * values[i], sign * values[i + 1]]
  if (!(a > 0 && b > 0 && c > 0)) return peak
  const [la, lb, lc] = [Math.log(a), Math.log(b), Math.log(c)]
  const denom = la - 2 * lb + lc
  if (!(denom < 0)) return peak
  const offset = (0.5 * (la - lc)) / denom
  if (Math.abs(offset) > 1) return peak
  return { at: i + offset, value: sign * Math.exp(lb - 0.25 * (la - lc) * offset) }
}
