import type request from 'supertest'
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs'

/** The text of every page, read back with pdfjs-dist (a general-purpose PDF reader, not our writer). */
export async function pdfText(buffer: Buffer): Promise<string> {
  const doc = await getDocument({ data: new Uint8Array(buffer), useSystemFonts: false, verbosity: 0 }).promise
  let text = ''
  for (let n = 1; n <= doc.numPages; n++) {
    const content = await (await doc.getPage(n)).getTextContent()
    text += content.items.map((i) => ('str' in i ? i.str : '')).join(' ') + '\n'
  }
  await doc.destroy()
  return text.replace(/\s+/g, ' ')
}

/** Supertest parser that collects a binary response body into a Buffer. */
export const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = []
  res.on('data', (c: Buffer) => chunks.push(c))
  res.on('end', () => cb(null, Buffer.concat(chunks)))
}
