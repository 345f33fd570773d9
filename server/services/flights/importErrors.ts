import { HttpError } from '../../errors.js'
import type { FieldIssue } from '../../../shared/types/api.js'
import type { RowErrorEntry } from '../../../shared/import/rowReport.js'

/** 422: the file is readable but its content cannot be stored. */
export const unprocessable = (message: string, details?: FieldIssue[]) =>
  new HttpError(422, 'UNPROCESSABLE', message, details)

/** 415: the file is not a text log, gzip or GPX. */
export const unsupportedType = (message: string) => new HttpError(415, 'UNSUPPORTED_MEDIA_TYPE', message)

/** Row errors as API field issues. */
export function rowIssues(rows: readonly RowErrorEntry[]): FieldIssue[] {
  return rows.map((r) => ({ path: `rows.${r.row}`, message: `Row ${r.row}, ${r.column}: ${r.reason}`, row: r.row, column: r.column }))
}
