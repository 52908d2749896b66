// The safety officer's isolation audit: its review states, filters, sorts, page size and note limits.
// schemas/isolations.ts builds the API's schemas from these.

export const reviewStates = ['pending', 'approved', 'rejected'] as const

export const ISOLATION_PAGE_SIZE = 20
/** 'any': records with at least one finding; 'serious': with a serious one. */
export const findingFilters = ['all', 'any', 'serious'] as const
/** 'severity': worst finding first (serious, minor, none), then newest; 'newest': by start time. */
export const isolationSorts = ['severity', 'newest'] as const

/** Shortest note that says why: a rejection always needs one, and so does approving a record that
 * has a serious finding (the server checks that against the record's findings). */
export const REVIEW_NOTE_MIN = 5
export const REVIEW_NOTE_MAX = 500
