/**
 * A short fingerprint of a header row, used to propose a saved mapping again for a file with the same header.
 * Case, surrounding spaces and a byte-order mark do not matter; order and names do.
 * @param names header cells in file order
 * @returns `h<column count>-<FNV-1a 32-bit hex>`
 */
export function headerSignature(names: readonly string[]): string {
  let h = 0x811c9dc5
  const text = names.map((n) => n.replace(/^\uFEFF/, '').trim().toLowerCase()).join('\u001f')
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i)
    // FNV-1a 32-bit prime multiply (Fowler–Noll–Vo, IETF draft-eastlake-fnv §2)
    h = Math.imul(h, 0x01000193) >>> 0
  }
  return `h${names.length}-${h.toString(16).padStart(8, '0')}`
}
