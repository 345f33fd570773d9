import { describe, expect, it } from 'vitest'
import { Op } from 'sequelize'
import { escapeLike, orderThenId, searchAnyColumn } from '../../../../server/services/listQuery.js'

describe('escapeLike', () => {
  it('escapes %, _ and the backslash itself, and leaves other text alone', () => {
    expect(escapeLike('50%_off\\now')).toBe('50\\%\\_off\\\\now')
    expect(escapeLike('North field, 2.4 GHz')).toBe('North field, 2.4 GHz')
  })
})

describe('searchAnyColumn', () => {
  it('matches the literal text inside any of the columns, ignoring case', () => {
    const where = searchAnyColumn(['name', 'notes'], 'a_b') as Record<symbol, unknown>
    expect(where[Op.or]).toEqual([{ name: { [Op.iLike]: '%a\\_b%' } }, { notes: { [Op.iLike]: '%a\\_b%' } }])
  })
})

describe('orderThenId', () => {
  it('breaks ties by id so pages never overlap', () => {
    expect(orderThenId('freqMhz', 'desc')).toEqual([
      ['freqMhz', 'DESC'],
      ['id', 'ASC'],
    ])
  })
})
