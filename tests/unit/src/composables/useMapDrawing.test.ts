import { describe, expect, it } from 'vitest'
import { drawClick, finishDraw, useMapDrawing, type DrawResult } from '@/composables/useMapDrawing'

describe('drawClick', () => {
  it('places the station at once, as lat/lon', () => {
    expect(drawClick('station', [], 52.1, -0.2).done).toEqual({ mode: 'station', lat: 52.1, lon: -0.2 })
  })
  it('finishes a point obstacle at once with [lon, lat]', () => {
    expect(drawClick('point', [], 52.1, -0.2).done).toEqual({ mode: 'point', coordinates: [[-0.2, 52.1]] })
  })
  it('collects line points without finishing', () => {
    const r = drawClick('line', [[0, 52]], 52.1, 0.1)
    expect(r).toEqual({ draft: [[0, 52], [0.1, 52.1]], done: null })
  })
  it('ignores clicks when no tool is chosen', () => expect(drawClick('none', [], 1, 2).done).toBeNull())
})

describe('finishDraw', () => {
  it('needs 3 points for an area and 2 for a route', () => {
    expect(finishDraw('polygon', [[0, 0], [1, 0]])).toBeNull()
    expect(finishDraw('polygon', [[0, 0], [1, 0], [1, 1]])?.mode).toBe('polygon')
    expect(finishDraw('route', [[0, 0], [1, 0]])).toEqual({ mode: 'route', coordinates: [[0, 0], [1, 0]] })
  })
})

describe('useMapDrawing', () => {
  it('reports a finished line and returns to no tool', () => {
    const done: DrawResult[] = []
    const d = useMapDrawing((r) => done.push(r))
    d.start('line')
    d.click(52, 0)
    expect(d.canFinish.value).toBe(false)
    d.click(52.001, 0.001)
    d.undo()
    d.click(52.002, 0.002)
    d.finish()
    expect(done).toEqual([{ mode: 'line', coordinates: [[0, 52], [0.002, 52.002]] }])
    expect(d.mode.value).toBe('none')
  })
})
