// Every route table of the API, in one list: mounted by app.ts and documented by openapi.ts.
import type { RouteDef } from '../route-table'
import { authRoutes } from './auth'
import { userRoutes } from './users'
import { mailOutboxRoutes } from './mail-outbox'
import { systemRoutes } from './system'
import { stringRoutes } from './strings'
import { visitRoutes } from './visits'
import { photoRoutes } from './photos'
import { engineRoutes } from './engine'
import { queueRoutes } from './queue'
import { routingRoutes } from './routing'
import { routingVrptwRoutes } from './routing-vrptw'
import { runRoutes } from './runs'
import { isolationRoutes } from './isolations'
import { overdueRoutes } from './overdue'
import { certificateRoutes } from './certificates'
import { reportRoutes } from './reports'
import { emergencyLogRoutes } from './emergency-logs'
import { managerRoutes } from './manager'
import { energyRoutes } from './energy'
import { registerRoutes } from './register'
import { settingsRoutes } from './settings'
import { adminJobRoutes } from './admin-jobs'
import { auditRoutes } from './audit'
import { noticeRoutes } from './notices'
import { stockRoutes } from './stock'
import { withEstate } from './estate'
import { seasonRoutes } from './season'

// The estate's routes (estate.ts) join the table; paths already here keep their answers.
export const allRoutes: RouteDef[] = withEstate([
  ...systemRoutes,
  ...authRoutes,
  ...userRoutes,
  ...mailOutboxRoutes,
  ...stringRoutes,
  ...visitRoutes,
  ...photoRoutes,
  ...engineRoutes,
  ...queueRoutes,
  ...routingRoutes,
  ...routingVrptwRoutes,
  ...runRoutes,
  ...isolationRoutes,
  ...overdueRoutes,
  ...certificateRoutes,
  ...reportRoutes,
  ...emergencyLogRoutes,
  ...managerRoutes,
  ...energyRoutes,
  ...registerRoutes,
  ...settingsRoutes,
  ...adminJobRoutes,
  ...auditRoutes,
  ...noticeRoutes,
  ...stockRoutes,
  ...seasonRoutes,
])
