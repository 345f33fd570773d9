import fsp from 'node:fs/promises'
import zlib from 'node:zlib'
import { unprocessable, unsupportedType } from './importErrors.js'

/** What an upload turned out to be, judged by its bytes rather than its name. */
export interface SniffResult {
  compressed: boolean
  format: 'delimited' | 'gpx'
  sizeBytes: number
  /** The first decoded text (up to 64 kB), for layout checks. */
  head: string
}

const HEAD_BYTES = 64 * 1024

/**
 * Reads the start of an upload: gzip by magic bytes (1f 8b), then text that must be UTF-8 without NUL bytes in the
 * first kilobyte; GPX when the text is XML with a <gpx element.
 * @param file path of the upload
 * @throws 415 for anything else (images, archives, executables, UTF-16), 422 for an empty file
 */
export async function sniffUpload(file: string): Promise<SniffResult> {
  const fh = await fsp.open(file, 'r')
  let raw: Buffer
  let sizeBytes: number
  try {
    sizeBytes = (await fh.stat()).size
    const buf = Buffer.alloc(Math.min(HEAD_BYTES, sizeBytes))
    const { bytesRead } = await fh.read(buf, 0, buf.length, 0)
    raw = buf.subarray(0, bytesRead)
  } finally {
    await fh.close()
  }
  if (sizeBytes === 0) throw unprocessable('The file is empty')
  const compressed = raw.length >= 2 && raw[0] === 0x1f && raw[1] === 0x8b
  let bytes = raw
  if (compressed) {
    try {
      // Sync flush: the head is cut mid-stream on purpose, so only real damage throws.
      bytes = zlib.gunzipSync(raw, { finishFlush: zlib.constants.Z_SYNC_FLUSH })
    } catch {
      throw unprocessable('The compressed file is damaged and cannot be read')
    }
    if (bytes.length === 0 && sizeBytes <= HEAD_BYTES) throw unprocessable('The file is empty')
  }
  const probe = bytes.subarray(0, 1024)
  if (probe.includes(0)) throw unsupportedType('The file is not a text log (it holds binary data)')
  let head: string
  try {
    head = new TextDecoder('utf-8', { fatal: true }).decode(trimPartialUtf8(bytes))
  } catch {
    throw unsupportedType('The file is not UTF-8 text')
  }
  const start = head.replace(/^\uFEFF/, '').trimStart()
  const format = start.startsWith('<') && /<gpx[\s>]/.test(start.slice(0, 4096)) ? 'gpx' : 'delimited'
  if (format === 'delimited' && start.startsWith('<')) throw unsupportedType('XML files other than GPX are not supported')
  return { compressed, format, sizeBytes, head }
}

/** Drops an incomplete UTF-8 sequence at the end of a cut buffer. */
function trimPartialUtf8(b: Buffer): Buffer {
  let i = b.length - 1
  let back = 0
  while (i >= 0 && back < 4 && (b[i]! & 0xc0) === 0x80) {
    i--
    back++
  }
  if (i < 0) return b
  const lead = b[i]!
  const need = lead >= 0xf0 ? 4 : lead >= 0xe0 ? 3 : lead >= 0xc0 ? 2 : 1
  return need > back + 1 ? b.subarray(0, i) : b
}
