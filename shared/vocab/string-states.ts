// One vocabulary for a string's state: the engine's verdict, the string record, the queue and the
// client's marks all spell each state the same way, as the API does (schemas/string-states.ts).

export const statuses = ['lit', 'watch', 'replace', 'dark', 'safe'] as const
export type StringStatus = (typeof statuses)[number]

/** The engine's verdict: every state but 'safe', which comes from a recorded isolation, not from physics. */
export const engineStates = ['lit', 'watch', 'replace', 'dark'] as const satisfies readonly StringStatus[]
export type EngineState = (typeof engineStates)[number]

/** The words for each state, in the API, the client, e-mails and docs alike. */
export const statusLabel: Record<StringStatus, string> = {
  lit: 'Lit',
  watch: 'Watch',
  replace: 'Replace now',
  dark: 'Dark',
  safe: 'Made safe',
}
