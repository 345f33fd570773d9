import { QueryTypes, type Transaction } from 'sequelize'
import { sequelize } from '../db.js'

// The flights table belongs to a later feature; until its migration has run nothing is in use.
async function flightsTableExists(transaction?: Transaction): Promise<boolean> {
  const [row] = await sequelize().query<{ t: string | null }>(`SELECT to_regclass('flights')::text AS t`, {
    type: QueryTypes.SELECT,
    transaction,
  })
  return Boolean(row?.t)
}

/**
 * Which of the given ids some flight points at, through flights.<column>.
 * @param column 'course_id' or 'setup_id'
 * @param ids row ids to check
 * @param transaction optional transaction to read in
 * @returns the subset of ids in use
 */
export async function idsUsedByFlights(
  column: 'course_id' | 'setup_id',
  ids: number[],
  transaction?: Transaction,
): Promise<Set<number>> {
  if (ids.length === 0 || !(await flightsTableExists(transaction))) return new Set()
  const rows = await sequelize().query<{ id: number }>(
    `SELECT DISTINCT ${column} AS id FROM flights WHERE ${column} IN (:ids)`,
    { type: QueryTypes.SELECT, replacements: { ids }, transaction },
  )
  return new Set(rows.map((r) => Number(r.id)))
}
