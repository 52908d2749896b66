export { solveTour, type SolveOptions, type TourRequest, type TourResult, type TourStop } from './solve'
export {
  DEFAULT_TIME_LIMIT_MS,
  EARTH_RADIUS_M,
  MAX_PLAN_CREWS,
  MAX_PLAN_ITEMS,
  MAX_STOPS_WITH_COORDINATES,
  MAX_STOPS_WITH_MATRIX,
  MAX_TIME_LIMIT_MS,
  planRequestTooLarge,
  tourRequestTooLarge,
} from './limits'
export { haversineMetres } from './geo'
export * from './plan'
