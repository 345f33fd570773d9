import { describe, expect, it } from 'vitest'
import { groupMapDropouts, mergeTimeBands } from '@/lib/dropoutGroups'

const at = (index: number, lat: number, lon: number, cause = 'range') => ({ index, lat, lon, cause, text: `#${index}` })

describe('groupMapDropouts', () => {
  it('merges same-cause markers in one small cell and keeps other causes and places apart', () => {
    const g = groupMapDropouts([at(0, 52.00001, -1.30001), at(1, 52.00002, -1.30002), at(2, 52.00002, -1.30002, 'gap'), at(3, 52.01, -1.3)])
    expect(g.map((x) => x.indices)).toEqual([[0, 1], [2], [3]])
    expect(g[0]!.index).toBe(0)
    expect(g[0]!.text).toBe('#0\n…and 1 more dropouts of this cause here')
    expect(g[1]!.text).toBe('#2')
  })
})

describe('mergeTimeBands', () => {
  it('joins same-cause bands closer than the gap and keeps the first index', () => {
    const bands = [
      { index: 0, startMs: 0, endMs: 1000, cause: 'range' },
      { index: 1, startMs: 1500, endMs: 2000, cause: 'range' },
      { index: 2, startMs: 1600, endMs: 1700, cause: 'gap' },
      { index: 3, startMs: 9000, endMs: 9500, cause: 'range' },
    ]
    expect(mergeTimeBands(bands, 500)).toEqual([
      { index: 0, startMs: 0, endMs: 2000, cause: 'range' },
      { index: 2, startMs: 1600, endMs: 1700, cause: 'gap' },
      { index: 3, startMs: 9000, endMs: 9500, cause: 'range' },
    ])
    expect(mergeTimeBands(bands, 0)).toHaveLength(4)
    expect(bands[0]!.endMs).toBe(1000)
  })
})
