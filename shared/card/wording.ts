/**
 * The scale card's printed wording, exported so the app's capture guide can say exactly what the card says.
 * DESIGN §10 asks for the handling cautions (guards on the picks, hold the boot, fingers off the edge).
 */

export const CAPTURE_STEPS: readonly string[] = [
  'Stand the skate on its blade on a plain surface clearly lighter or darker than the steel, holding it by the boot.',
  'Stand this card upright right behind the runner, touching it, its bottom edge on the table, both blade ends inside the band.',
  'From 30–60 cm, a little above the table, photograph square-on with the whole card and blade in the frame; avoid glare.',
]

export const HANDLING_CAUTIONS: readonly string[] = [
  'Keep the guards on the toe picks.',
  'Hold the boot, not the blade.',
  'Keep your fingers off the edge.',
]

export const ASSEMBLY_STEPS: readonly string[] = [
  'Print both sheets at 100 % (actual size, no fit to page).',
  'Cut sheet 2 on its dashed line.',
  'Lay its cut edge on the solid line of sheet 1 so the short rules run straight across; tape the back.',
]

export const CHECK_BAR_NOTE = 'Measure from tick to tick with a ruler once after printing and enter your reading with this card id in the app.'

/** Greedy word wrap to at most `maxChars` characters a line (the card's fonts are proportional; this is a budget). */
export function wrapText(text: string, maxChars: number): string[] {
  const out: string[] = []
  let line = ''
  for (const word of text.split(/\s+/)) {
    if (line && line.length + 1 + word.length > maxChars) {
      out.push(line)
      line = word
    } else {
      line = line ? `${line} ${word}` : word
    }
  }
  if (line) out.push(line)
  return out
}
