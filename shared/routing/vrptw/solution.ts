import type { VrptwModel } from './model'
import { Route } from './route'

/** Routes (one per vehicle, possibly empty) and the stops left unserved. */
export class Solution {
  constructor(
    readonly m: VrptwModel,
    public routes: Route[],
    public unserved: number[],
  ) {}

  static empty(m: VrptwModel): Solution {
    return new Solution(
      m,
      Array.from({ length: m.v }, (_, k) => new Route(m, k)),
      [],
    )
  }

  /** A solution from stops per vehicle (assumed feasible); nothing unserved yet. */
  static from(m: VrptwModel, routes: readonly (readonly number[])[]): Solution {
    return new Solution(
      m,
      Array.from({ length: m.v }, (_, k) => new Route(m, k, routes[k] ?? [])),
      [],
    )
  }

  copy(): Solution {
    return new Solution(
      this.m,
      this.routes.map((r) => r.copy()),
      this.unserved.slice(),
    )
  }

  distance(): number {
    let d = 0
    for (const r of this.routes) d += r.cost
    return d
  }

  /** Weighted count of unserved stops: the first term of the objective. */
  penalty(): number {
    let p = 0
    for (const x of this.unserved) p += this.m.weight[x]
    return p
  }

  usedRoutes(): number {
    return this.routes.filter((r) => r.stopCount > 0).length
  }

  /** Removes the given stops from their routes and adds them to `unserved`. */
  removeStops(stops: readonly number[]): void {
    const gone = new Set(stops)
    for (const r of this.routes) {
      if (!r.nodes.some((x) => gone.has(x))) continue
      r.nodes = r.nodes.filter((x, p) => p === 0 || p === r.nodes.length - 1 || !gone.has(x))
      r.update()
    }
    this.unserved.push(...stops)
  }
}

/** True when a is strictly better than b: fewer unserved (weighted), then shorter. */
export function better(
  a: { penalty: number; distance: number },
  b: { penalty: number; distance: number },
): boolean {
  if (a.penalty !== b.penalty) return a.penalty < b.penalty
  return a.distance < b.distance - 1e-9
}
