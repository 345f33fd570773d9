import type { ComparisonInput, ComparisonPreviewInput } from '../../shared/schemas/comparison.js'
import type { ListResult } from '../../shared/types/api.js'
import type { ComparisonDetailDto, ComparisonDto, ComparisonResultDto } from '../../shared/types/comparison.js'
import { forbidden, notFound } from '../errors.js'
import { canEditOwned, type AuthContext } from '../middleware/auth.js'
import { Comparison } from '../models/Comparison.js'
import { User } from '../models/User.js'
import { computeComparison } from './comparisonResult.js'

function toDto(c: Comparison, createdByName: string | null): ComparisonDto {
  return {
    id: c.id,
    name: c.name,
    conclusion: c.conclusion,
    flightIds: c.flightIds,
    baselineId: c.baselineId,
    fadeMarginDb: c.fadeMarginDb,
    createdBy: c.createdBy,
    createdByName,
    createdAt: c.createdAt.toISOString(),
    updatedAt: c.updatedAt.toISOString(),
  }
}

async function authorName(userId: number | null): Promise<string | null> {
  if (userId === null) return null
  const u = await User.findByPk(userId, { attributes: ['name'] })
  return u?.name ?? null
}

async function findRow(teamId: number, id: number): Promise<Comparison> {
  const row = await Comparison.findOne({ where: { id, teamId } })
  if (!row) throw notFound(`Comparison ${id}`)
  return row
}

/**
 * Computes a comparison without saving it.
 * @param teamId the caller's team
 * @param input flight ids, baseline id, fade margin (dB)
 * @returns the result
 * @throws HttpError 404 for unknown flights, 409 for flights not analysed yet
 */
export async function previewComparison(teamId: number, input: ComparisonPreviewInput): Promise<ComparisonResultDto> {
  return computeComparison(teamId, input)
}

/**
 * Lists the team's saved comparisons, newest first.
 * @param teamId the caller's team
 * @returns items and total
 */
export async function listComparisons(teamId: number): Promise<ListResult<ComparisonDto>> {
  const rows = await Comparison.findAll({ where: { teamId }, order: [['updatedAt', 'DESC'], ['id', 'DESC']] })
  const ids = [...new Set(rows.map((r) => r.createdBy).filter((v): v is number => v !== null))]
  const users = ids.length ? await User.findAll({ where: { id: ids }, attributes: ['id', 'name'] }) : []
  const names = new Map(users.map((u) => [u.id, u.name]))
  return { items: rows.map((r) => toDto(r, r.createdBy === null ? null : (names.get(r.createdBy) ?? null))), total: rows.length }
}

/**
 * A saved comparison with its result recomputed from the flights as they are now.
 * @param teamId the caller's team
 * @param id comparison id
 * @returns the saved choices and the result
 * @throws HttpError 404 when unknown or another team's; 404/409 when a flight is gone or not analysed
 */
export async function getComparison(teamId: number, id: number): Promise<ComparisonDetailDto> {
  const row = await findRow(teamId, id)
  const result = await computeComparison(teamId, {
    flightIds: row.flightIds,
    baselineId: row.baselineId,
    fadeMarginDb: row.fadeMarginDb,
  })
  return { ...toDto(row, await authorName(row.createdBy)), result }
}

/**
 * Saves a comparison after checking that every flight is the team's and analysed.
 * @param auth the caller (writer role)
 * @param input name, conclusion, flight ids, baseline, fade margin
 * @returns the saved comparison
 * @throws HttpError 404/409 from the flight checks
 */
export async function createComparison(auth: AuthContext, input: ComparisonInput): Promise<ComparisonDto> {
  await computeComparison(auth.teamId, input)
  const row = await Comparison.create({ ...input, teamId: auth.teamId, createdBy: auth.userId })
  return toDto(row, await authorName(auth.userId))
}

/**
 * Updates a saved comparison (admins any, pilots and instructors their own).
 * @param auth the caller
 * @param id comparison id
 * @param input the new choices, name and conclusion
 * @returns the updated comparison
 * @throws HttpError 404 when unknown, 403 when not the caller's to edit
 */
export async function updateComparison(auth: AuthContext, id: number, input: ComparisonInput): Promise<ComparisonDto> {
  const row = await findRow(auth.teamId, id)
  if (!canEditOwned(auth, row.createdBy)) throw forbidden('Only its author or an admin may change this comparison')
  await computeComparison(auth.teamId, input)
  await row.update(input)
  return toDto(row, await authorName(row.createdBy))
}

/**
 * Deletes a saved comparison (admins any, pilots and instructors their own); the flights stay.
 * @param auth the caller
 * @param id comparison id
 * @throws HttpError 404 when unknown, 403 when not the caller's to delete
 */
export async function deleteComparison(auth: AuthContext, id: number): Promise<void> {
  const row = await findRow(auth.teamId, id)
  if (!canEditOwned(auth, row.createdBy)) throw forbidden('Only its author or an admin may delete this comparison')
  await row.destroy()
}
