import type { AuthContext } from '../types/express.js'
import type { ColumnMappingDto, SaveColumnMappingInput } from '../../shared/import/mapping.js'
import type { ListResult } from '../../shared/types/api.js'
import { ColumnMapping } from '../models/ColumnMapping.js'

function toDto(m: ColumnMapping): ColumnMappingDto {
  return { id: m.id, name: m.name, headerSignature: m.headerSignature, mapping: m.mapping, createdAt: m.createdAt.toISOString() }
}

/**
 * The team's saved mappings, newest first; with a signature, only those made for that header.
 * @param teamId the caller's team
 * @param signature optional header signature (see shared/import/headerSignature)
 */
export async function listColumnMappings(teamId: number, signature?: string): Promise<ListResult<ColumnMappingDto>> {
  const rows = await ColumnMapping.findAll({
    where: { teamId, ...(signature ? { headerSignature: signature } : {}) },
    order: [['updatedAt', 'DESC'], ['id', 'DESC']],
    limit: 200,
  })
  return { items: rows.map(toDto), total: rows.length }
}

/**
 * The most recently saved mapping for a header, or null.
 * @param teamId the team
 * @param signature header signature
 */
export async function findMappingBySignature(teamId: number, signature: string): Promise<ColumnMappingDto | null> {
  const row = await ColumnMapping.findOne({ where: { teamId, headerSignature: signature }, order: [['updatedAt', 'DESC'], ['id', 'DESC']] })
  return row ? toDto(row) : null
}

/**
 * Saves a mapping under a name for the team; saving again under the same name replaces it.
 * @param auth the caller (a writer role)
 * @param input name, header signature and the mapping
 * @returns the saved mapping and whether it was new
 */
export async function saveColumnMapping(auth: AuthContext, input: SaveColumnMappingInput): Promise<{ mapping: ColumnMappingDto; created: boolean }> {
  const existing = await ColumnMapping.findOne({ where: { teamId: auth.teamId, name: input.name } })
  if (existing) {
    existing.set({ headerSignature: input.headerSignature, mapping: input.mapping })
    existing.changed('updatedAt', true)
    await existing.save()
    return { mapping: toDto(existing), created: false }
  }
  const row = await ColumnMapping.create({ teamId: auth.teamId, createdBy: auth.userId, ...input })
  return { mapping: toDto(row), created: true }
}
