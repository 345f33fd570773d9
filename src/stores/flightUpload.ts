import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref, shallowRef } from 'vue'
import { columnMappingSchema, type ColumnMapping, type ColumnMappingDto } from '@shared/import/mapping'
import type { RowReportDto } from '@shared/import/rowReport'
import type { FieldIssue } from '@shared/types/api'
import * as flightsApi from '@/api/flights'
import type { FlightStatusDto, NewFlightFields } from '@/api/flights'
import * as mappingsApi from '@/api/columnMappings'
import { ApiError } from '@/api/client'
import {
  friendlyMappingMessage,
  logKind,
  previewFromText,
  proposeMapping,
  readLogHead,
  type LogKind,
  type LogPreview,
} from '@/lib/logPreview'
import { importProgress } from '@/lib/importProgress'
import { signalLogMappingIssues, toSignalLogMapping } from '@/lib/signalLogMapping'

export type UploadPhase = 'form' | 'sending' | 'processing' | 'ready' | 'failed'

/** Why an upload did not make a flight: the message, field/row details and the row report if any. */
export interface UploadFailure {
  message: string
  details: FieldIssue[]
  report: RowReportDto | null
}

/** How long to wait between status polls, ms. */
export const POLL_INTERVAL_MS = 400

const wait = (ms: number) => new Promise<void>((r) => setTimeout(r, ms))

/**
 * The new-flight journey: pick a log, preview it and confirm its column mapping, send it, then follow
 * the server's import until the flight is ready (or failed, with rows and columns named).
 */
export const useFlightUploadStore = defineStore('flightUpload', () => {
  const file = shallowRef<File | null>(null)
  const signalFile = shallowRef<File | null>(null)
  const kind = ref<LogKind | null>(null)
  const preview = ref<LogPreview | null>(null)
  const mapping = ref<ColumnMapping | null>(null)
  const savedMatch = ref<ColumnMappingDto | null>(null)
  const phase = ref<UploadPhase>('form')
  const sentFraction = ref(0)
  const status = ref<FlightStatusDto | null>(null)
  const flightId = ref<number | null>(null)
  const failure = ref<UploadFailure | null>(null)

  const progress = computed(() => importProgress(sentFraction.value, status.value))
  const mappingIssues = computed(() => {
    if (!mapping.value) return []
    // a GPX track's signal log has no position columns: it is checked as the server reads it
    if (kind.value === 'gpx') return signalLogMappingIssues(mapping.value).map(friendlyMappingMessage)
    const r = columnMappingSchema.safeParse(mapping.value)
    return r.success ? [] : [...new Set(r.error.issues.map((i) => friendlyMappingMessage(i.message)))]
  })
  /** The file whose columns are being mapped: the log itself, or a GPX track's separate signal log. */
  const mappedFile = computed(() => (kind.value === 'gpx' ? signalFile.value : file.value))

  async function readPreview(f: File): Promise<void> {
    const { text, complete } = await readLogHead(f)
    const p = previewFromText(text, complete)
    preview.value = p
    mapping.value = proposeMapping(p)
    savedMatch.value = null
    try {
      const saved = await mappingsApi.listColumnMappings(p.signature)
      const match = saved.items.find((m) => m.headerSignature === p.signature)
      if (match) {
        savedMatch.value = match
        mapping.value = structuredClone(match.mapping)
      }
    } catch {
      // no saved mapping to offer: the proposal stands
    }
  }

  /** Takes the chosen log; a delimited one is previewed and given a proposed mapping. */
  async function chooseFile(f: File): Promise<void> {
    const k = logKind(f.name)
    if (k === 'unsupported') throw new RangeError('Choose a .csv, .tsv or .txt log (optionally .gz), or a .gpx track.')
    file.value = f
    kind.value = k
    signalFile.value = null
    preview.value = null
    mapping.value = null
    savedMatch.value = null
    if (k === 'delimited') await readPreview(f)
  }

  /** For a GPX track: a separate signal log, aligned by time on the server. */
  async function chooseSignalFile(f: File | null): Promise<void> {
    signalFile.value = f
    preview.value = null
    mapping.value = null
    if (f) {
      if (logKind(f.name) !== 'delimited') throw new RangeError('The signal log must be a .csv, .tsv or .txt file.')
      await readPreview(f)
    }
  }

  function setMapping(m: ColumnMapping): void {
    mapping.value = m
  }

  async function saveMapping(name: string): Promise<ColumnMappingDto> {
    if (!preview.value || !mapping.value) throw new RangeError('Choose a log first.')
    const saved = await mappingsApi.saveColumnMapping({ name, headerSignature: preview.value.signature, mapping: mapping.value })
    savedMatch.value = saved
    return saved
  }

  function fail(e: unknown): void {
    phase.value = 'failed'
    if (e instanceof ApiError) failure.value = { message: e.message, details: e.details, report: null }
    else throw e
  }

  /** Follows the import until it is ready or failed. */
  async function follow(id: number, intervalMs = POLL_INTERVAL_MS): Promise<void> {
    for (;;) {
      const st = await flightsApi.getFlightStatus(id)
      status.value = st
      if (st.status === 'ready') {
        phase.value = 'ready'
        return
      }
      if (st.status === 'failed') {
        phase.value = 'failed'
        failure.value = { message: st.failure?.message ?? 'The import failed.', details: st.failure?.details ?? [], report: null }
        return
      }
      await wait(intervalMs)
    }
  }

  /** Sends the log with its fields and follows the import. */
  async function submit(fields: Omit<NewFlightFields, 'mapping'>): Promise<void> {
    if (!file.value) throw new RangeError('Choose a log first.')
    phase.value = 'sending'
    sentFraction.value = 0
    status.value = null
    failure.value = null
    try {
      // GPX: the edited mapping describes the separate signal log, sent as signalMapping
      const gpx = kind.value === 'gpx'
      const sent = {
        ...fields,
        mapping: gpx ? null : mapping.value,
        signalMapping: gpx && signalFile.value && mapping.value ? toSignalLogMapping(mapping.value) : null,
      }
      const res = await flightsApi.createFlight(sent, file.value, signalFile.value, (done, totalBytes) => {
        sentFraction.value = totalBytes > 0 ? done / totalBytes : 0
      })
      sentFraction.value = 1
      flightId.value = res.id
      phase.value = 'processing'
      await follow(res.id)
    } catch (e) {
      fail(e)
    }
  }

  function reset(): void {
    file.value = null
    signalFile.value = null
    kind.value = null
    preview.value = null
    mapping.value = null
    savedMatch.value = null
    phase.value = 'form'
    sentFraction.value = 0
    status.value = null
    flightId.value = null
    failure.value = null
  }

  /** Back to the form after a failure, keeping the file and mapping so the user can fix and resend. */
  function retry(): void {
    phase.value = 'form'
    status.value = null
    failure.value = null
  }

  return {
    file,
    signalFile,
    kind,
    preview,
    mapping,
    savedMatch,
    phase,
    sentFraction,
    status,
    flightId,
    failure,
    progress,
    mappingIssues,
    mappedFile,
    chooseFile,
    chooseSignalFile,
    setMapping,
    saveMapping,
    follow,
    submit,
    reset,
    retry,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useFlightUploadStore, import.meta.hot))
