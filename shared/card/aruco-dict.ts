/**
 * DICT_4X4_50 of the open ArUco marker standard, as shipped in OpenCV: one 16-character string per id, the 4 × 4
 * inner cells read row by row from the top-left, "1" = white, "0" = black. The black one-cell border around these
 * cells is not stored. Extracted once from @techstark/opencv-js 4.12.0-release.1 with generateImageMarker; a unit test
 * compares this table with that function so it cannot drift.
 */
export const DICT_4X4_50_BITS: readonly string[] = [
  '1011010100110010', // 0
  '0000111110011010', // 1
  '0011001100101101', // 2
  '1001100101000110', // 3
  '0101010010011110', // 4
  '0111100111001101', // 5
  '1001111000101110', // 6
  '1100010011110010', // 7
  '1111111011011010', // 8
  '1100111101010110', // 9
  '1111100110010001', // 10
  '0001000110100111', // 11
  '0000111010110111', // 12
  '0010101000001111', // 13
  '0010010010110001', // 14
  '0010011000111110', // 15
  '0100011001100101', // 16
  '0110011000000000', // 17
  '0110110001011110', // 18
  '0111011010101111', // 19
  '1000011010001011', // 20
  '1011000000101011', // 21
  '1100110011010101', // 22
  '1101110110000010', // 23
  '1111111001000111', // 24
  '1001010001110001', // 25
  '1010110011100100', // 26
  '1010010101010100', // 27
  '0010000100100011', // 28
  '0011010001101111', // 29
  '0100010000010101', // 30
  '0101011110110010', // 31
  '1001111011001111', // 32
  '1111000011001011', // 33
  '0000100010101110', // 34
  '0000100100101001', // 35
  '0001100001110101', // 36
  '0000010011111111', // 37
  '0000110111110110', // 38
  '0001110001011010', // 39
  '0001011100011000', // 40
  '0010101000101000', // 41
  '0011001010001100', // 42
  '0011100010110010', // 43
  '0010010011101000', // 44
  '0010111011101011', // 45
  '0010110100111111', // 46
  '0100101101100100', // 47
  '0101000000101110', // 48
  '0101000000010011', // 49
]

/** Cells per marker side including the black one-cell border (4 data cells + 2). */
export const MARKER_CELLS = 6

/**
 * The full 6 × 6 cell grid of a DICT_4X4_50 marker, row by row from the top-left as printed: 1 = white, 0 = black.
 * Throws for an id outside 0–49, so a layout cannot silently print a marker the detector does not know.
 */
export function markerGrid(id: number): number[] {
  const bits = DICT_4X4_50_BITS[id]
  if (!Number.isInteger(id) || bits === undefined) throw new RangeError(`DICT_4X4_50 has no marker id ${id}`)
  const grid: number[] = []
  for (let row = 0; row < MARKER_CELLS; row++) {
    for (let col = 0; col < MARKER_CELLS; col++) {
      const inner = row > 0 && row < 5 && col > 0 && col < 5
      grid.push(inner ? Number(bits[(row - 1) * 4 + (col - 1)]) : 0)
    }
  }
  return grid
}
