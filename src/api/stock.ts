import type { z } from 'zod'
import type {
  adjustmentResult,
  AdjustmentBody,
  LoadOut,
  LowLevelBody,
  OrderList,
  StockLine,
  StockQuery,
  TransferBody,
  transferResult,
  UsageResult,
} from '../../shared/schemas/stock'
import { http } from './http'

export type { LoadOut, OrderList, StockLine, UsageResult }

export const stockApi = {
  /** Crews get their own van only; planners every place (or the one asked for). */
  list: (q: StockQuery = {}) => http.get<{ items: StockLine[] }>('/stock', q),
  transfer: (b: TransferBody) => http.post<z.infer<typeof transferResult>>('/stock/transfers', b),
  adjust: (b: AdjustmentBody) => http.post<z.infer<typeof adjustmentResult>>('/stock/adjustments', b),
  setLowLevel: (b: LowLevelBody) => http.put<StockLine>('/stock/low-levels', b),
  usage: (q: { from?: string; to?: string; clientId?: number }) => http.get<UsageResult>('/stock/usage', q),
  orderList: (q: { from?: string; to?: string }) => http.get<OrderList>('/stock/order-list', q),
  /** Without a crew: the signed-in crew member's van; without a date: tomorrow. */
  loadOut: (q: { crewId?: number; date?: string }) => http.get<LoadOut>('/stock/load-out', q),
}
