// A string's state as the API validates it; the states and their words are in ../vocab/string-states.ts.
import { z } from 'zod'
import { engineStates, statuses } from '../vocab/string-states'

export const statusSchema = z.enum(statuses)
export const engineStateSchema = z.enum(engineStates)
