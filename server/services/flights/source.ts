import fs from 'node:fs'
import type { Readable } from 'node:stream'
import zlib from 'node:zlib'
import { unprocessable, unsupportedType } from './importErrors.js'

export interface TextSourceOptions {
  compressed: boolean
  /** Read only this many bytes of the file (a partial pre-check); a cut gzip stream is then not an error. */
  limitBytes?: number
  /** Read size, bytes (default 64 KiB). */
  chunkBytes?: number
}

/** A decoded chunk and the file bytes consumed so far. */
export interface TextChunk {
  text: string
  bytesRead: number
}

/** A raw (gunzipped) chunk and the file bytes consumed so far. */
export interface ByteChunk {
  bytes: Buffer
  bytesRead: number
}

/**
 * Streams a file's bytes, gunzipping when compressed; never holds more than one chunk. UTF-8 is not checked here.
 * @throws 422 for a truncated or damaged gzip stream, 415 for NUL bytes
 */
export async function* readByteChunks(file: string, opts: TextSourceOptions): AsyncGenerator<ByteChunk> {
  const partial = opts.limitBytes !== undefined
  const fileStream = fs.createReadStream(file, {
    highWaterMark: opts.chunkBytes ?? 64 * 1024,
    ...(partial ? { end: Math.max(0, opts.limitBytes! - 1) } : {}),
  })
  let bytesRead = 0
  fileStream.on('data', (b: Buffer | string) => {
    bytesRead += b.length
  })
  const stream: Readable = opts.compressed
    ? fileStream.pipe(zlib.createGunzip({ chunkSize: opts.chunkBytes ?? 16 * 1024, ...(partial ? { finishFlush: zlib.constants.Z_SYNC_FLUSH } : {}) }))
    : fileStream
  if (opts.compressed) fileStream.on('error', (e) => stream.destroy(e))
  try {
    for await (const buf of stream as AsyncIterable<Buffer>) {
      if (buf.includes(0)) throw unsupportedType('The file holds NUL bytes: it is not a text log')
      yield { bytes: buf, bytesRead }
    }
  } catch (e) {
    if ((e as { code?: string }).code?.startsWith('Z_') || (e as { errno?: number }).errno === -5) {
      throw unprocessable('The compressed file is truncated or damaged')
    }
    throw e
  } finally {
    fileStream.destroy()
    stream.destroy()
  }
}

/**
 * Decodes streamed bytes as UTF-8 text.
 * @param chunks raw chunks
 * @param partial the bytes are a cut-off head: an unfinished last character is not an error
 * @throws 422 for invalid UTF-8
 */
export async function* decodeChunks(chunks: AsyncIterable<ByteChunk>, partial: boolean): AsyncGenerator<TextChunk> {
  const decoder = new TextDecoder('utf-8', { fatal: true })
  let bytesRead = 0
  for await (const chunk of chunks) {
    let text: string
    try {
      text = decoder.decode(chunk.bytes, { stream: true })
    } catch {
      throw unprocessable(`The file is not valid UTF-8 text (near byte ${chunk.bytesRead})`)
    }
    bytesRead = chunk.bytesRead
    yield { text, bytesRead }
  }
  if (!partial) {
    try {
      const tail = decoder.decode()
      if (tail) yield { text: tail, bytesRead }
    } catch {
      throw unprocessable('The file ends inside a UTF-8 character')
    }
  }
}

/**
 * Streams a file as UTF-8 text, gunzipping when compressed; never holds more than one chunk.
 * @throws 422 for a truncated or damaged gzip stream or invalid UTF-8, 415 for NUL bytes
 */
export function readTextChunks(file: string, opts: TextSourceOptions): AsyncGenerator<TextChunk> {
  return decodeChunks(readByteChunks(file, opts), opts.limitBytes !== undefined)
}
