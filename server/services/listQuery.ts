import { Op, type Order, type WhereOptions } from 'sequelize'

/** Escapes LIKE wildcards (and the escape character) so user text matches literally. */
export function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (ch) => `\\${ch}`)
}

/**
 * The list search: `text` anywhere in any of `columns`, case-insensitive and literal.
 * @param columns model attribute names to search
 * @param text the user's search text (non-empty)
 * @returns a where-fragment to merge into the list's where
 */
export function searchAnyColumn(columns: readonly string[], text: string): WhereOptions {
  const like = `%${escapeLike(text)}%`
  return { [Op.or]: columns.map((c) => ({ [c]: { [Op.iLike]: like } })) }
}

/**
 * ORDER BY a whitelisted column, then id, so equal values keep a stable order and pages never overlap.
 * @param column the model attribute, already mapped from a whitelisted sort key
 * @param order 'asc' or 'desc'
 */
export function orderThenId(column: string, order: 'asc' | 'desc'): Order {
  return [
    [column, order.toUpperCase()],
    ['id', 'ASC'],
  ]
}
