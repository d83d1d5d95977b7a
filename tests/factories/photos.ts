import { deflateSync } from 'node:zlib'
import sharp from 'sharp'
import { renderScene } from '../../fixtures/synthetic/render'
import { sampleScene, type SceneOptions } from '../../fixtures/synthetic/scene'

/** A generated blade photo (JPEG) with the scene it came from, rendered at test time. */
export async function generatedPhoto(seed: number, options: SceneOptions = {}) {
  const scene = sampleScene(seed, { resolution: '3mp', ...options })
  const photo = await renderScene(scene)
  return { scene, jpeg: photo.jpeg, truth: photo.truth }
}

/**
 * The first generated photo, from a fixed list of seeds, that the engine measures: the engine is developed on its
 * own and may refuse a given scene in one version and measure it in the next, while these tests need a measurable
 * photo to follow it through upload, queue, worker and page.
 */
export async function measurablePhoto(options: SceneOptions = {}, seeds = [3, 2, 4, 11, 6, 1, 5, 7, 8, 12]) {
  const { analyzePhoto } = await import('../../workers/engine/analyze')
  // Square-on scenes first (the simplest), then the same seeds with the generator's own camera poses.
  for (const frontal of [true, false]) {
    for (const seed of seeds) {
      const photo = await generatedPhoto(seed, { frontal, discipline: 'freestyle', ...options })
      const outcome = await analyzePhoto(photo.jpeg, { sizeIn: photo.scene.blade.nominalSizeIn, discipline: photo.scene.blade.discipline })
      if (outcome.ok) return photo
    }
  }
  throw new Error(`the engine measures none of the generated photos (seeds ${seeds.join(', ')})`)
}

function crc32(bytes: Buffer): number {
  let crc = ~0
  for (const byte of bytes) {
    crc ^= byte
    for (let k = 0; k < 8; k++) crc = (crc >>> 1) ^ (0xedb88320 & -(crc & 1))
  }
  return ~crc >>> 0
}

function chunk(type: string, data: Buffer): Buffer {
  const head = Buffer.alloc(8)
  head.writeUInt32BE(data.length, 0)
  head.write(type, 4, 'ascii')
  const crc = Buffer.alloc(4)
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])), 0)
  return Buffer.concat([head, data, crc])
}

/**
 * A valid 1-bit greyscale PNG of width × height whose pixels are all black: a few hundred kB on disk that would
 * decode to width × height pixels, the shape of a decompression bomb. Built by hand per the PNG specification
 * (ISO/IEC 15948: signature, IHDR, IDAT, IEND with CRC-32).
 */
export function pngBomb(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13)
  ihdr.writeUInt32BE(width, 0)
  ihdr.writeUInt32BE(height, 4)
  ihdr.set([1, 0, 0, 0, 0], 8)
  const row = 1 + Math.ceil(width / 8)
  const raw = Buffer.alloc(row * height)
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw, { level: 9 })), chunk('IEND', Buffer.alloc(0)),
  ])
}

/** A small JPEG carrying EXIF (a camera make) and orientation 6: stored upright it is `height` wide. */
export function jpegWithExif(width: number, height: number): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 180, g: 170, b: 160 } } })
    .withExif({ IFD0: { Make: 'Test camera' } })
    .withMetadata({ orientation: 6 })
    .jpeg()
    .toBuffer()
}
