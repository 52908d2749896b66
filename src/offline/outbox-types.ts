import type { IsolationBody, VisitBody } from '../../shared/schemas/visits'
import type { PhotoItem } from '../../shared/schemas/photos'
import type { VisitResult } from '../api/visits'
import type { VisitDraft } from './visit-record'
import type { EmergencyLog, EmergencyLogBody } from '../../shared/schemas/report-work'
import type { SeasonRecord, SeasonSent } from './season-record'

export type EntryKind = 'isolation' | 'visit' | 'photo' | 'emergency' | 'season'
/** pending: waiting or retrying; failed: the server refused it (4xx) and a person must decide; sent: done. */
export type EntryState = 'pending' | 'failed' | 'sent'

export interface EntryError {
  status: number
  code: string
  message: string
  /** zod field errors from `validation_failed`, so the form can point at the right field again. */
  fields: { path: string; message: string }[]
}

interface EntryBase {
  /** The Idempotency-Key: made on the phone before any network call, so a retry is never a second record. */
  key: string
  /** Creation order; the sender keeps it (isolation → visit → photos within one save). */
  seq: number
  /** One save of the visit form: its isolation, visit and photos. */
  groupId: string
  userId: number
  stringId: number
  assetTag: string
  createdAt: string
  state: EntryState
  attempts: number
  /** Epoch ms before which the sender leaves it alone (back-off after a network failure). */
  nextAttemptAt: number
  lastError: EntryError | null
  sentAt: string | null
}

export interface IsolationEntry extends EntryBase {
  kind: 'isolation'
  body: IsolationBody
}

export interface VisitEntry extends EntryBase {
  kind: 'visit'
  body: VisitBody
  /** What the person typed, so a refused visit can be reopened in the form and corrected. */
  draft: VisitDraft
  result: VisitResult | null
}

export interface PhotoEntry extends EntryBase {
  kind: 'photo'
  /** The visit's own key: its id is only known once the visit has been accepted. */
  visitKey: string
  /** Set instead for an emergency log's photo: the log's key (emergency-record.ts). */
  logKey?: string
  /** Set instead for a season record's photo (commissioning, take-down): the record's key. */
  seasonKey?: string
  fileName: string
  /** Dropped once sent, to give the phone its storage back. */
  file: Blob | null
  result: PhotoItem | null
}

/** The crew's log of an emergency (hazard report) stop; `stringId` is 0 for a report placed by street only. */
export interface EmergencyEntry extends EntryBase {
  kind: 'emergency'
  itemId: number
  body: EmergencyLogBody
  result: EmergencyLog | null
}

/** A commissioning, take-down or store inspection (season-record.ts); its photos follow it. */
export interface SeasonEntry extends EntryBase {
  kind: 'season'
  record: SeasonRecord
  result: SeasonSent | null
}

export type OutboxEntry = IsolationEntry | VisitEntry | PhotoEntry | EmergencyEntry | SeasonEntry

/** One save of the visit form as the form hands it over: its requests, built, and what was typed. */
export interface QueuedSave {
  /** The save being replaced (a refused one reopened), or a new key. */
  groupId: string
  isolation: IsolationBody | null
  visit: VisitBody
  /** Kept to reopen a refused save; its photos become entries of their own. */
  draft: VisitDraft
}
