// Throwaway test scene (not committed): card + simple blade warped into a photo.
import sharp from 'sharp'
import { getCv } from './opencv'
import { cardLayout } from '../../shared/card/layout'

export async function makeScene(opts: { dark: boolean; toeLeft: boolean; W: number; H: number; seed?: number }) {
  const cv = await getCv()
  const L = cardLayout('a4')
  const r = 8
  const cw = Math.round(L.widthMm * r), ch = Math.round((L.heightMm + 30) * r)
  const card = new cv.Mat(ch, cw, cv.CV_8UC1, new cv.Scalar(60))
  cv.rectangle(card, new cv.Point(0, 0), new cv.Point(cw, Math.round(L.heightMm * r)), new cv.Scalar(215), -1)
  const dict = cv.getPredefinedDictionary(cv.DICT_4X4_50)
  for (const m of L.markers) {
    const s = Math.round(L.markerSizeMm * r)
    const mk = new cv.Mat(); cv.generateImageMarker(dict, m.id, s, mk, 1)
    const roi = card.roi(new cv.Rect(Math.round(m.cornersMm[0][0] * r), Math.round(m.cornersMm[0][1] * r), s, s))
    mk.copyTo(roi); roi.delete(); mk.delete()
  }
  const R = 2200, Hc = L.heightMm, xc = 200
  const pts: number[][] = []
  const x0 = 95, x1 = 385
  const bottom = (x: number) => Hc - (R - Math.sqrt(R * R - (x - xc) ** 2))
  // toe picks zigzag
  pts.push([x0, Hc - 40]); pts.push([x0 + 4, Hc - 22]); pts.push([x0 + 8, Hc - 28]); pts.push([x0 + 13, Hc - 14]); pts.push([x0 + 17, Hc - 20]); pts.push([x0 + 23, Hc - 6.5])
  pts.push([x0 + 27, Hc - 12])
  for (let x = x0 + 32; x <= x1; x += 1) pts.push([x, bottom(x)])
  pts.push([x1, Hc - 55]); pts.push([x0 + 10, Hc - 60])
  const fl = pts.map(([x, y]) => [opts.toeLeft ? x : L.widthMm - x, y])
  const poly = cv.matFromArray(fl.length, 1, cv.CV_32SC2, fl.flatMap(([x, y]) => [Math.round(x * r * 16), Math.round(y * r * 16)]))
  const mv = new cv.MatVector(); mv.push_back(poly)
  cv.fillPoly(card, mv, new cv.Scalar(opts.dark ? 110 : 250), cv.LINE_AA, 4)
  // photo homography: card mm*r -> photo px
  const sc = (opts.W * 0.85) / cw
  const src = cv.matFromArray(4, 1, cv.CV_32FC2, [0, 0, cw, 0, cw, ch, 0, ch])
  const ox = opts.W * 0.07, oy = opts.H * 0.25
  const dst = cv.matFromArray(4, 1, cv.CV_32FC2, [ox, oy, ox + cw * sc, oy + 20, ox + cw * sc - 30, oy + ch * sc * 0.95, ox + 25, oy + ch * sc])
  const Hm = cv.getPerspectiveTransform(src, dst)
  const photo = new cv.Mat()
  cv.warpPerspective(card, photo, Hm, new cv.Size(opts.W, opts.H), cv.INTER_AREA, cv.BORDER_CONSTANT, new cv.Scalar(90))
  cv.GaussianBlur(photo, photo, new cv.Size(0, 0), 1.2)
  const jpeg = await sharp(Buffer.from(photo.data), { raw: { width: opts.W, height: opts.H, channels: 1 } }).jpeg({ quality: 90 }).toBuffer()
  const hArr = Array.from(Hm.data64F as Float64Array)
  // card mm -> photo: Hm * diag(r,r,1)
  const Hmm = [hArr[0] * r, hArr[1] * r, hArr[2], hArr[3] * r, hArr[4] * r, hArr[5], hArr[6] * r, hArr[7] * r, hArr[8]]
  return { jpeg, Hmm, truthEdge: fl }
}
