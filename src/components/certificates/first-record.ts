// A subject with no certificate yet, shaped as the row the "Record new test" form starts from: no
// earlier dates, readings or inspector, the first kind that fits the subject.
import type { CertificateRecord } from '../../api/safety'
import type { CertificateSubject } from '../../api/certificate-work'
import { KINDS_FOR_SUBJECT } from './certificate-format'
import { today } from '../../dates'

export function firstRecordBase(s: CertificateSubject): CertificateRecord {
  return {
    id: 0,
    kind: KINDS_FOR_SUBJECT[s.subjectType][0],
    subjectType: s.subjectType,
    subjectId: s.subjectId,
    subjectLabel: s.label,
    reference: null,
    doneOn: today(),
    nextDue: null,
    result: 'pass',
    inspector: null,
    readings: null,
    notes: null,
    daysToDue: null,
    circuit: null,
    document: null,
  }
}
