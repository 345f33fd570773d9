import type { ColumnMapping } from '@shared/import/mapping'
import { SIGNAL_LOG_ROLES, signalLogMappingSchema, type SignalLogMapping } from '@shared/import/signalLog'

const ROLES = new Set<string>(SIGNAL_LOG_ROLES)

/**
 * The mapping of a GPX track's separate signal log, as the server reads it (field `signalMapping`): the time and
 * signal columns of the edited mapping; position, height and extra columns are not read from a signal log.
 * @param m the mapping edited for the signal log
 */
export function toSignalLogMapping(m: ColumnMapping): SignalLogMapping {
  return {
    delimiter: m.delimiter,
    decimalComma: m.decimalComma,
    timeFormat: m.timeFormat,
    columns: m.columns.map((c) => ({ index: c.index, name: c.name, role: ROLES.has(c.role) ? (c.role as SignalLogMapping['columns'][number]['role']) : 'ignore' })),
  }
}

/**
 * What keeps a signal-log mapping from being sent, in plain words (empty when it is fine).
 * @param m the mapping edited for the signal log
 */
export function signalLogMappingIssues(m: ColumnMapping): string[] {
  const issues: string[] = []
  const r = signalLogMappingSchema.safeParse(toSignalLogMapping(m))
  if (!r.success) issues.push(...r.error.issues.map((i) => i.message))
  if (m.signalUnit !== 'dbm') issues.push('A separate signal log must give the signal in dBm')
  return [...new Set(issues)]
}
