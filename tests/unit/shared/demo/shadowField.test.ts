import { describe, expect, it } from 'vitest'
import { createShadowField } from '../../../../shared/demo/shadowField.js'
import { createSeededRandom } from '../../../../shared/demo/random.js'

describe('createShadowField', () => {
  it('has about the requested spread over a large area', () => {
    const field = createShadowField(3, 4, 40)
    let s = 0
    let s2 = 0
    let n = 0
    for (let x = -3000; x <= 3000; x += 37) {
      for (let y = -3000; y <= 3000; y += 41) {
        const v = field.atDb(x, y)
        s += v
        s2 += v * v
        n++
      }
    }
    const sd = Math.sqrt(s2 / n - (s / n) ** 2)
    expect(sd).toBeGreaterThan(3)
    expect(sd).toBeLessThan(5)
  })
  it('is the same at the same place and smooth over a few metres', () => {
    const field = createShadowField(3, 4, 40)
    expect(field.atDb(120, 80)).toBe(field.atDb(120, 80))
    expect(Math.abs(field.atDb(120, 80) - field.atDb(121, 80))).toBeLessThan(1)
  })
})

describe('createSeededRandom', () => {
  it('repeats its stream for the same seed and gives standard normals', () => {
    const a = createSeededRandom(42)
    const b = createSeededRandom(42)
    expect([a.uniform(), a.uniform()]).toEqual([b.uniform(), b.uniform()])
    const r = createSeededRandom(5)
    let s = 0
    let s2 = 0
    for (let i = 0; i < 20000; i++) {
      const z = r.normal()
      s += z
      s2 += z * z
    }
    expect(s / 20000).toBeCloseTo(0, 1)
    expect(s2 / 20000).toBeCloseTo(1, 1)
  })
  it('rejects a non-integer seed', () => expect(() => createSeededRandom(1.5)).toThrow(/seed/))
})
