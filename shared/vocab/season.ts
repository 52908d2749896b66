// A string's season in words: its states from the store to the street and back, where it hangs over,
// and the condition of what comes down. schemas/season.ts builds the API's schemas from these.

export const seasonStates = ['in_store', 'installed', 'in_service', 'taken_down', 'needs_repair'] as const
export type SeasonState = (typeof seasonStates)[number]

export const seasonStateLabel: Record<SeasonState, string> = {
  in_store: 'In store',
  installed: 'Installed',
  in_service: 'In service',
  taken_down: 'Taken down',
  needs_repair: 'Needs repair',
}

/** Where a string hangs over: the clearance it needs follows the place (trade-reference §7). */
export const clearancePlaces = ['carriageway', 'footway'] as const
export type ClearancePlace = (typeof clearancePlaces)[number]

/** The condition of a taken-down string's cable and connectors. */
export const conditions = ['good', 'worn', 'damaged'] as const
