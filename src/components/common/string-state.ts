export const STRING_STATES = ['lit', 'watch', 'replace', 'dark', 'safe'] as const
export type StringState = (typeof STRING_STATES)[number]

// One vocabulary across API, UI, e-mails and docs (product brief, "Words").
export const STATE_WORDS: Record<StringState, string> = {
  lit: 'Lit',
  watch: 'Watch',
  replace: 'Replace now',
  dark: 'Dark',
  safe: 'Made safe',
}
