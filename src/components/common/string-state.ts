// The string states and their words are the API's own (shared/vocab/string-states.ts); the client
// only names them for its components.
export {
  statuses as STRING_STATES,
  statusLabel as STATE_WORDS,
  type StringStatus as StringState,
} from '../../../shared/vocab/string-states'
