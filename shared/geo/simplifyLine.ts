import { createLocalProjection, projectToLocal } from './localProjection.js'

/**
 * Simplifies a track to a clean line (Douglas–Peucker in a local metric plane): keeps the first and last point and
 * every point that lies more than toleranceM from the chord it would otherwise be dropped onto.
 * @param coords [lon, lat] pairs in degrees, in order
 * @param toleranceM largest sideways distance in metres a dropped point may lie from the kept line, > 0
 * @returns the kept [lon, lat] pairs, in order; consecutive duplicates removed; at most coords.length
 * @throws RangeError when toleranceM is not a positive finite number
 */
export function simplifyLine(coords: readonly (readonly [number, number])[], toleranceM: number): [number, number][] {
  if (!(toleranceM > 0) || !Number.isFinite(toleranceM)) throw new RangeError(`toleranceM must be > 0, got ${toleranceM}`)
  // repeated fixes (a craft standing still) would give zero-length chords
  const pts: [number, number][] = []
  for (const c of coords) {
    const last = pts[pts.length - 1]
    if (!last || last[0] !== c[0] || last[1] !== c[1]) pts.push([c[0], c[1]])
  }
  if (pts.length <= 2) return pts
  const proj = createLocalProjection(pts[0]![1], pts[0]![0])
  const xy = pts.map(([lon, lat]) => projectToLocal(proj, lat, lon))
  const keep = new Uint8Array(pts.length)
  keep[0] = 1
  keep[pts.length - 1] = 1
  // an explicit stack: a long track would overflow the call stack when recursing
  const stack: [number, number][] = [[0, pts.length - 1]]
  const tol2 = toleranceM * toleranceM
  while (stack.length > 0) {
    const [a, b] = stack.pop()!
    const pa = xy[a]!
    const pb = xy[b]!
    const dx = pb.eastM - pa.eastM
    const dy = pb.northM - pa.northM
    const len2 = dx * dx + dy * dy
    let worst = -1
    let worstD2 = tol2
    for (let i = a + 1; i < b; i++) {
      const p = xy[i]!
      let ex = p.eastM - pa.eastM
      let ey = p.northM - pa.northM
      if (len2 > 0) {
        // distance to the segment, not the infinite line, so a track that doubles back keeps its turn
        const t = Math.max(0, Math.min(1, (ex * dx + ey * dy) / len2))
        ex -= t * dx
        ey -= t * dy
      }
      const d2 = ex * ex + ey * ey
      if (d2 > worstD2) {
        worstD2 = d2
        worst = i
      }
    }
    if (worst >= 0) {
      keep[worst] = 1
      stack.push([a, worst], [worst, b])
    }
  }
  return pts.filter((_, i) => keep[i] === 1)
}
