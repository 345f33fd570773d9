/** A colour-vision type the palette is checked against. */
export type VisionType = 'normal' | 'protanopia' | 'deuteranopia' | 'tritanopia'

// Machado, Oliveira & Fernandes (IEEE TVCG 2009), severity 1.0, linear RGB; recalled from memory, treat as approximate
const MATRICES: Record<VisionType, number[][]> = {
  normal: [[1, 0, 0], [0, 1, 0], [0, 0, 1]],
  protanopia: [[0.152286, 1.052583, -0.204868], [0.114503, 0.786281, 0.099216], [-0.003882, -0.048116, 1.051998]],
  deuteranopia: [[0.367322, 0.860646, -0.227968], [0.280085, 0.672501, 0.047413], [-0.01182, 0.04294, 0.968881]],
  tritanopia: [[1.255528, -0.076749, -0.178779], [-0.078411, 0.930809, 0.147602], [0.004733, 0.691367, 0.3039]],
}

function srgbToLinear(c8: number): number {
  const c = c8 / 255
  // IEC 61966-2-1 sRGB transfer function
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4
}

/**
 * CIELAB coordinates of a hex colour as seen with a given colour vision (D65 white).
 * @param hex colour as '#rrggbb'
 * @param vision vision type to simulate
 * @returns [L*, a*, b*]
 * @throws TypeError when hex is not '#rrggbb'
 */
export function perceivedLab(hex: string, vision: VisionType): [number, number, number] {
  if (!/^#[0-9a-f]{6}$/i.test(hex)) throw new TypeError(`hex must be #rrggbb, got ${hex}`)
  const rgb = [1, 3, 5].map((i) => srgbToLinear(parseInt(hex.slice(i, i + 2), 16)))
  const m = MATRICES[vision]
  const [r, g, b] = m.map((row) => Math.min(1, Math.max(0, row[0]! * rgb[0]! + row[1]! * rgb[1]! + row[2]! * rgb[2]!)))
  // sRGB (D65) to XYZ, then CIE 1976 L*a*b*
  const x = (0.4124 * r! + 0.3576 * g! + 0.1805 * b!) / 0.95047
  const y = 0.2126 * r! + 0.7152 * g! + 0.0722 * b!
  const z = (0.0193 * r! + 0.1192 * g! + 0.9505 * b!) / 1.08883
  const f = (t: number) => (t > 0.008856 ? Math.cbrt(t) : 7.787 * t + 16 / 116)
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))]
}

/**
 * CIE76 colour difference between two hex colours under a simulated vision type.
 * @param a colour '#rrggbb'
 * @param b colour '#rrggbb'
 * @param vision vision type (default normal)
 * @returns ΔE*ab, >= 0 (about 2.3 is just noticeable; above 20 is clearly different)
 * @throws TypeError when a colour is malformed
 */
export function colourDifference(a: string, b: string, vision: VisionType = 'normal'): number {
  const p = perceivedLab(a, vision)
  const q = perceivedLab(b, vision)
  return Math.hypot(p[0] - q[0], p[1] - q[1], p[2] - q[2])
}
