import fs from 'node:fs'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import { removeOrphanTempFiles, serverFileName, tmpDir } from '../../server/services/flights/storage.js'

describe('removeOrphanTempFiles', () => {
  it('removes old uploads nobody needs and keeps fresh ones and those an import still reads', async () => {
    fs.mkdirSync(tmpDir(), { recursive: true })
    const make = (ageH: number) => {
      const f = path.join(tmpDir(), serverFileName())
      fs.writeFileSync(f, 'x')
      const t = new Date(Date.now() - ageH * 3600_000)
      fs.utimesSync(f, t, t)
      return f
    }
    const old = make(10)
    const oldInUse = make(10)
    const fresh = make(0)
    const removed = await removeOrphanTempFiles(new Set([oldInUse]), 6 * 3600_000)
    expect(removed).toBeGreaterThanOrEqual(1)
    expect([fs.existsSync(old), fs.existsSync(oldInUse), fs.existsSync(fresh)]).toEqual([false, true, true])
    fs.rmSync(oldInUse)
    fs.rmSync(fresh)
  })
})
