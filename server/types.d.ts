import type { Role } from '../shared/roles'

declare global {
  namespace Express {
    interface Request {
      user?: { id: number; name: string; email: string; role: Role; crewId: number | null }
    }
  }
}

export {}
