import { describe, expect, it } from 'vitest'
import { DICT_4X4_50_BITS, MARKER_CELLS, markerGrid } from '../../../shared/card/aruco-dict'
import { loadOpenCv } from './opencv'

describe('DICT_4X4_50 table', () => {
  // Reference: OpenCV's own generator (general-purpose library), cv.generateImageMarker, one pixel per cell.
  it('matches opencv generateImageMarker for every id', async () => {
    const cv = await loadOpenCv()
    const dict = cv.getPredefinedDictionary(cv.DICT_4X4_50)
    try {
      expect(DICT_4X4_50_BITS).toHaveLength(50)
      for (let id = 0; id < 50; id++) {
        const img = new cv.Mat()
        try {
          cv.generateImageMarker(dict, id, MARKER_CELLS, img, 1)
          const fromCv = Array.from(img.data, (v) => (v > 127 ? 1 : 0))
          expect(markerGrid(id), `marker ${id}`).toEqual(fromCv)
        } finally {
          img.delete()
        }
      }
    } finally {
      dict.delete()
    }
  }, 30_000)

  it('refuses ids the dictionary does not have', () => {
    expect(() => markerGrid(50)).toThrow(RangeError)
    expect(() => markerGrid(-1)).toThrow(RangeError)
  })
})
