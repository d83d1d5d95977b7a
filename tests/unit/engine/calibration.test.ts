import { describe, expect, it } from 'vitest'
import { getCv, withMats } from '../../../workers/engine/opencv'
import { detectMarkers, reduce } from '../../../workers/engine/markers'
import { refineMarkerCorners, fitLine } from '../../../workers/engine/subpixel'
import { distort, undistort, planePose, offsetPlaneHomography, type Distortion } from '../../../workers/engine/camera'
import { apply, multiply, type Mat3, type Pt } from '../../../workers/engine/projective'

describe('marker corners', () => {
  it('refines ArUco corners drawn by OpenCV to within 0.1 px after blur', async () => {
    const cv = await getCv()
    // Marker drawn by OpenCV's own generateImageMarker: its outer border spans pixels [x, x + side), so in
    // pixel-centre coordinates its corners lie at x − 0.5 and x + side − 0.5.
    const { grey, truth } = withMats((track) => {
      const img = track(new cv.Mat(900, 1200, cv.CV_8UC1, new cv.Scalar(225)))
      const dict = track(cv.getPredefinedDictionary(cv.DICT_4X4_50))
      const truth: Record<number, Pt[]> = {}
      for (const [id, x, y, side] of [[3, 101, 90, 180], [17, 700, 400, 240]]) {
        const m = track(new cv.Mat())
        cv.generateImageMarker(dict, id, side, m, 1)
        const roi = track(img.roi(new cv.Rect(x, y, side, side)))
        m.copyTo(roi)
        truth[id] = [[x - 0.5, y - 0.5], [x + side - 0.5, y - 0.5], [x + side - 0.5, y + side - 0.5], [x - 0.5, y + side - 0.5]]
      }
      const blurred = track(new cv.Mat())
      cv.GaussianBlur(img, blurred, new cv.Size(9, 9), 1.8)
      return { grey: { data: new Uint8Array(blurred.data), width: 1200, height: 900 }, truth }
    })
    const found = withMats((track) => {
      const m = track(new cv.Mat(900, 1200, cv.CV_8UC1))
      m.data.set(grey.data)
      const { mat, scale } = reduce(cv, m, 500)
      track(mat)
      return detectMarkers(cv, mat, scale).markers
    })
    expect(found.map((f) => f.id).sort((a, b) => a - b)).toEqual([3, 17])
    for (const marker of found) {
      const refined = refineMarkerCorners(grey, marker, 5)
      expect(refined).not.toBeNull()
      refined!.forEach((p, i) => {
        expect(Math.hypot(p[0] - truth[marker.id][i][0], p[1] - truth[marker.id][i][1])).toBeLessThan(0.1)
      })
    }
  }, 60_000)

  it('fits a line through points with an outlier', () => {
    const pts: Pt[] = Array.from({ length: 20 }, (_, i) => [i, 2 * i + 1 + (i % 2 ? 0.01 : -0.01)] as Pt)
    pts.push([5, 40])
    const line = fitLine(pts)!
    // y = 2x + 1 ⇔ (−2x + y)/√5 = 1/√5
    expect(Math.abs(line.ny / line.nx)).toBeCloseTo(0.5, 3)
    expect(Math.abs(line.c / line.ny)).toBeCloseTo(1, 2)
  })
})

describe('lens and pose', () => {
  const d: Distortion = { k: -0.08, cx: 1999.5, cy: 1499.5, norm: 2500 }

  it('division model inverts exactly', () => {
    for (const p of [[10, 20], [3990, 2990], [2000, 1500], [1200, 2700]] as Pt[]) {
      const back = distort(d, undistort(d, p))
      expect(Math.hypot(back[0] - p[0], back[1] - p[1])).toBeLessThan(1e-6)
    }
  })

  it('recovers focal length from a tilted card and maps points on a plane in front of it', () => {
    const f = 3100
    const tilt = (25 * Math.PI) / 180
    const roll = (12 * Math.PI) / 180
    const rx: Mat3 = [1, 0, 0, 0, Math.cos(tilt), -Math.sin(tilt), 0, Math.sin(tilt), Math.cos(tilt)]
    const rz: Mat3 = [Math.cos(roll), -Math.sin(roll), 0, Math.sin(roll), Math.cos(roll), 0, 0, 0, 1]
    const r = multiply(rz, rx)
    const t = [-220, -90, 480]
    const k: Mat3 = [f, 0, d.cx, 0, f, d.cy, 0, 0, 1]
    const h = multiply(k, [r[0], r[1], t[0], r[3], r[4], t[1], r[6], r[7], t[2]])
    const pose = planePose(h, d, 4000, 3000)
    expect(pose.focalFromPhoto).toBe(true)
    expect(pose.focalPx).toBeCloseTo(f, 0)
    // A card-frame point (x, y) on the plane z = −2 (toward the camera), projected by the pinhole model directly.
    const hz = offsetPlaneHomography(pose, d, -2)
    for (const [x, y] of [[0, 0], [300, 150], [120, 210]] as Pt[]) {
      const cam = [0, 1, 2].map((i) => r[3 * i] * x + r[3 * i + 1] * y + r[3 * i + 2] * -2 + t[i])
      const expected: Pt = [(f * cam[0]) / cam[2] + d.cx, (f * cam[1]) / cam[2] + d.cy]
      const got = apply(hz, [x, y])
      expect(Math.hypot(got[0] - expected[0], got[1] - expected[1])).toBeLessThan(1e-6)
    }
  })
})
