import fs from 'node:fs'
import fsp from 'node:fs/promises'
import path from 'node:path'
import { randomBytes } from 'node:crypto'
import { pipeline } from 'node:stream/promises'
import zlib from 'node:zlib'
import { config } from '../../config.js'

/** Folder for uploads still being checked or imported (server-made names only). */
export function tmpDir(): string {
  return path.join(config().dataDir, 'tmp')
}

/** Folder for kept originals, gzip-compressed. */
export function rawDir(): string {
  return path.join(config().dataDir, 'raw')
}

/** Creates both folders when missing. */
export async function ensureStorageDirs(): Promise<void> {
  await fsp.mkdir(tmpDir(), { recursive: true })
  await fsp.mkdir(rawDir(), { recursive: true })
}

/** A fresh server-made file name (no user text ever reaches a path). */
export function serverFileName(): string {
  return `${Date.now().toString(36)}-${randomBytes(12).toString('hex')}`
}

/** Deletes files, ignoring ones already gone. */
export async function removeFiles(...files: Array<string | null | undefined>): Promise<void> {
  await Promise.all(files.filter((f): f is string => Boolean(f)).map((f) => fsp.rm(f, { force: true })))
}

/**
 * Keeps an uploaded original under raw/, compressed: a gzip upload is moved as is, anything else is gzipped (fastest
 * level: it runs beside the analysis, and logs still shrink about fourfold).
 * @param tempFile the upload in tmp/
 * @param compressed whether it is already gzip
 * @returns the kept file's path
 */
export async function archiveOriginal(tempFile: string, compressed: boolean): Promise<string> {
  await fsp.mkdir(rawDir(), { recursive: true })
  const target = path.join(rawDir(), `${path.basename(tempFile)}.gz`)
  if (compressed) {
    await fsp.rename(tempFile, target)
    return target
  }
  const part = `${target}.part`
  try {
    await pipeline(fs.createReadStream(tempFile), zlib.createGzip({ level: 1 }), fs.createWriteStream(part))
    await fsp.rename(part, target)
  } catch (e) {
    await removeFiles(part)
    throw e
  }
  await removeFiles(tempFile)
  return target
}

/** Whether a path lies inside the data folder (guards deletes against a tampered column). */
export function insideDataDir(file: string): boolean {
  const rel = path.relative(config().dataDir, path.resolve(file))
  return !rel.startsWith('..') && !path.isAbsolute(rel)
}

/**
 * Deletes files in tmp/ older than `maxAgeMs` that no unfinished import still needs (left by a crash mid-upload).
 * @param inUse paths an unfinished import still reads
 * @param maxAgeMs minimum age before a file counts as orphaned, ms
 * @returns how many files were removed
 */
export async function removeOrphanTempFiles(inUse: ReadonlySet<string>, maxAgeMs: number): Promise<number> {
  const dir = tmpDir()
  const names = await fsp.readdir(dir).catch(() => [] as string[])
  let removed = 0
  for (const name of names) {
    const file = path.join(dir, name)
    if (inUse.has(file)) continue
    const st = await fsp.stat(file).catch(() => null)
    if (st?.isFile() && Date.now() - st.mtimeMs > maxAgeMs) {
      await removeFiles(file)
      removed++
    }
  }
  return removed
}
