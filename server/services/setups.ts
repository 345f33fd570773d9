import { ForeignKeyConstraintError, QueryTypes, type Transaction, type WhereOptions } from 'sequelize'
import type { AuthContext } from '../types/express.js'
import type { ListResult } from '../../shared/types/api.js'
import type { LinkSetupDto, SetupSortKey } from '../../shared/types/setup.js'
import type { SetupInput, SetupListQuery } from '../../shared/schemas/setup.js'
import { resolveRxAntenna, setupEirpDbm } from '../../shared/setup/derive.js'
import { dbmToMw } from '../../shared/units/power.js'
import { conflict, forbidden, notFound } from '../errors.js'
import { canEditOwned } from '../middleware/auth.js'
import { sequelize } from '../db.js'
import { LinkSetup } from '../models/LinkSetup.js'
import { idsUsedByFlights } from './flightUsage.js'
import { orderThenId, searchAnyColumn } from './listQuery.js'

const SORT_COLUMNS: Record<SetupSortKey, string> = { name: 'name', band: 'band', freqMHz: 'freqMhz', createdAt: 'createdAt' }

/** Maps a setup row to its DTO; EIRP and mW are derived. */
function toSetupDto(s: LinkSetup, inUse: boolean): LinkSetupDto {
  return {
    id: s.id,
    teamId: s.teamId,
    createdBy: s.createdBy,
    lineageId: s.lineageId,
    version: s.version,
    isCurrent: s.isCurrent,
    name: s.name,
    band: s.band,
    freqMHz: s.freqMhz,
    channel: s.channel,
    txPowerDbm: s.txPowerDbm,
    txPowerMw: dbmToMw(s.txPowerDbm),
    txAntenna: s.txAntenna,
    rxAntennas: s.rxAntennas,
    cableLossDb: s.cableLossDb,
    sensitivityDbm: s.sensitivityDbm,
    floorDbm: s.floorDbm,
    notes: s.notes,
    eirpDbm: setupEirpDbm(s.txPowerDbm, s.txAntenna.gainDbi),
    inUse,
    createdAt: s.createdAt.toISOString(),
  }
}

function columnsOf(input: SetupInput) {
  return {
    name: input.name,
    band: input.band,
    freqMhz: input.freqMHz,
    channel: input.channel || null,
    txPowerDbm: input.txPowerDbm,
    txAntenna: input.txAntenna,
    rxAntennas: input.rxAntennas.map((a, i) => resolveRxAntenna(a, i)),
    cableLossDb: input.cableLossDb,
    sensitivityDbm: input.sensitivityDbm,
    floorDbm: input.floorDbm,
    notes: input.notes,
  }
}

async function dtos(rows: LinkSetup[]): Promise<LinkSetupDto[]> {
  const used = await idsUsedByFlights('setup_id', rows.map((r) => r.id))
  return rows.map((r) => toSetupDto(r, used.has(r.id)))
}

/**
 * The team's setups, current versions only, searched by name, band or notes, sorted, one page.
 * @returns one page and the total count
 */
export async function listSetups(teamId: number, q: SetupListQuery): Promise<ListResult<LinkSetupDto>> {
  const where: WhereOptions = { teamId, isCurrent: true }
  if (q.q) Object.assign(where, searchAnyColumn(['name', 'band', 'notes'], q.q))
  const { rows, count } = await LinkSetup.findAndCountAll({
    where,
    order: orderThenId(SORT_COLUMNS[q.sort], q.order),
    limit: q.limit,
    offset: q.offset,
  })
  return { items: await dtos(rows), total: count }
}

async function findRow(teamId: number, id: number, transaction?: Transaction): Promise<LinkSetup> {
  const row = await LinkSetup.findOne({ where: { id, teamId }, transaction, lock: transaction ? true : undefined })
  if (!row) throw notFound(`Link setup ${id}`)
  return row
}

/**
 * One setup version of the caller's team (old versions too: flights point at them).
 * @throws HttpError 404 for an unknown id or another team's setup
 */
export async function getSetup(teamId: number, id: number): Promise<LinkSetupDto> {
  const [dto] = await dtos([await findRow(teamId, id)])
  return dto!
}

/**
 * A setup version by id without team scoping, for server-side callers (analysis jobs).
 * @returns the setup, or null when it does not exist
 */
export async function loadSetup(id: number): Promise<LinkSetupDto | null> {
  const row = await LinkSetup.findByPk(id)
  return row ? ((await dtos([row]))[0] ?? null) : null
}

/**
 * Every version of the setup that `id` belongs to, newest first.
 * @throws HttpError 404 for an unknown id or another team's setup
 */
export async function listSetupVersions(teamId: number, id: number): Promise<LinkSetupDto[]> {
  const row = await findRow(teamId, id)
  const rows = await LinkSetup.findAll({ where: { teamId, lineageId: row.lineageId }, order: [['version', 'DESC']] })
  return dtos(rows)
}

/**
 * Creates version 1 of a new setup in the caller's team.
 * @returns the created setup
 */
export async function createSetup(auth: AuthContext, input: SetupInput): Promise<LinkSetupDto> {
  const row = await sequelize().transaction(async (transaction) => {
    const [next] = await sequelize().query<{ id: string }>(
      `SELECT nextval(pg_get_serial_sequence('link_setups', 'id')) AS id`,
      { type: QueryTypes.SELECT, transaction },
    )
    const id = Number(next!.id)
    return LinkSetup.create(
      { ...columnsOf(input), id, lineageId: id, version: 1, isCurrent: true, teamId: auth.teamId, createdBy: auth.userId },
      { transaction },
    )
  })
  return toSetupDto(row, false)
}

/**
 * Edits the current version of a setup. When a flight uses that version, the edit becomes a new version
 * (same lineage, version + 1, current) and the old row is kept for its flights; otherwise the row
 * changes in place.
 * @returns the edited or the new version
 * @throws HttpError 404 for another team's setup, 409 CONFLICT when `id` is not the current version
 */
export async function updateSetup(auth: AuthContext, id: number, input: SetupInput): Promise<LinkSetupDto> {
  const row = await sequelize().transaction(async (transaction) => {
    const cur = await findRow(auth.teamId, id, transaction)
    if (!cur.isCurrent) throw conflict('This is an old version; edit the current version of the setup')
    const used = await idsUsedByFlights('setup_id', [cur.id], transaction)
    if (!used.has(cur.id)) return cur.update(columnsOf(input), { transaction })
    await cur.update({ isCurrent: false }, { transaction })
    return LinkSetup.create(
      {
        ...columnsOf(input),
        teamId: cur.teamId,
        createdBy: auth.userId,
        lineageId: cur.lineageId,
        version: cur.version + 1,
        isCurrent: true,
      },
      { transaction },
    )
  })
  return toSetupDto(row, false)
}

/**
 * Deletes a setup with all its versions. Only its creator or an admin may delete.
 * @throws HttpError 404 for another team's setup, 403 for someone else's, 409 when a flight uses any version
 */
export async function deleteSetup(auth: AuthContext, id: number): Promise<void> {
  const inUse = () => conflict('Flights use this setup; it is kept for them')
  try {
    await sequelize().transaction(async (transaction) => {
      const row = await findRow(auth.teamId, id, transaction)
      const versions = await LinkSetup.findAll({ where: { lineageId: row.lineageId, teamId: auth.teamId }, transaction })
      const first = versions.find((v) => v.id === row.lineageId)
      if (!canEditOwned(auth, first?.createdBy ?? row.createdBy)) {
        throw forbidden('Only the setup’s creator or an admin can delete it')
      }
      const ids = versions.map((v) => v.id)
      if ((await idsUsedByFlights('setup_id', ids, transaction)).size > 0) throw inUse()
      await LinkSetup.destroy({ where: { id: ids }, transaction })
    })
  } catch (e) {
    if (e instanceof ForeignKeyConstraintError) throw inUse()
    throw e
  }
}
