import type {
  AssessRequest,
  AssessResponse,
  CircuitRequest,
  CircuitResponse,
  ColdResistanceRequest,
  ColdResistanceResponse,
  EstimateShortedRequest,
  EstimateShortedResponse,
  ForecastRequest,
  ForecastResponse,
} from '../../shared/schemas/engine'
import { http } from './http'

// The server's copy of the string engine. Pages that only preview (the calculator) run
// shared/engine locally instead, so they keep working without signal; these calls are for
// results that must match what the server stores.
export const engineApi = {
  assess: (req: AssessRequest) => http.post<AssessResponse>('/engine/assess', req),
  forecast: (req: ForecastRequest) => http.post<ForecastResponse>('/engine/forecast', req),
  estimateShorted: (req: EstimateShortedRequest) =>
    http.post<EstimateShortedResponse>('/engine/estimate-shorted', req),
  coldResistance: (req: ColdResistanceRequest) =>
    http.post<ColdResistanceResponse>('/engine/cold-resistance', req),
  circuit: (req: CircuitRequest) => http.post<CircuitResponse>('/engine/circuit', req),
}
