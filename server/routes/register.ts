import { managers, office } from '../../shared/roles'
import {
  exportQuery,
  importBody,
  importResult,
  registerPage,
  registerQuery,
  templateQuery,
  IMPORT_FIELD,
  IMPORT_MAX_MB,
  IMPORT_MAX_ROWS,
} from '../../shared/schemas/register'
import { defineRoute, type RouteDef } from '../route-table'
import { badRequest } from '../errors'
import { listRegister } from '../services/register'
import { exportRegister, writeTemplate } from '../services/register/export'
import { importRegister } from '../services/register/import'
import { registerUpload } from '../middleware/register-upload'
import { readRegisterInPool } from '../workers/heavy-jobs'

const xlsx = /\.xlsx$/i

export const registerRoutes: RouteDef[] = [
  defineRoute({
    method: 'get',
    path: '/register',
    access: office,
    tag: 'register',
    summary: 'One page of the register (strings with type, place, circuit, structure), filtered and sorted',
    query: registerQuery,
    response: registerPage,
    handler: ({ deps, query }) => listRegister(deps.db, query),
  }),
  defineRoute({
    method: 'get',
    path: '/register/template',
    access: managers,
    tag: 'register',
    summary: 'The import file’s columns with one example row (CSV or XLSX)',
    query: templateQuery,
    responseType: 'text/csv',
    handler: ({ deps, query, res }) => writeTemplate(deps.db, res, query.format),
  }),
  defineRoute({
    method: 'get',
    path: '/register/export',
    access: office,
    tag: 'register',
    summary: 'The register with the page’s filters as a file (CSV or XLSX), streamed, formulas neutralised',
    query: exportQuery,
    responseType: 'text/csv',
    handler: ({ deps, query, res }) => exportRegister(deps.db, res, query),
  }),
  defineRoute({
    method: 'post',
    path: '/register/import',
    access: managers,
    tag: 'register',
    summary: `Import strings from a CSV or XLSX (multipart field "${IMPORT_FIELD}", ≤ ${IMPORT_MAX_MB} MB, ≤ ${IMPORT_MAX_ROWS} rows), matched by asset tag; dryRun writes nothing, strict writes nothing if a row fails`,
    body: importBody,
    bodyType: 'multipart',
    response: importResult,
    before: () => [registerUpload],
    handler: ({ deps, body, req, res, user }) => {
      const file = req.file
      if (!file) throw badRequest('missing_file', `Send the file in the form field "${IMPORT_FIELD}".`)
      const format = xlsx.test(file.originalname) || file.mimetype.includes('spreadsheetml') ? 'xlsx' : 'csv'
      return importRegister(deps.db, {
        bytes: new Uint8Array(file.buffer.buffer, file.buffer.byteOffset, file.buffer.byteLength),
        format,
        dryRun: body.dryRun === 'true',
        mode: body.mode,
        userId: user.id,
        requestId: String(req.id),
        readInPool: (input) => readRegisterInPool(input, { userId: user.id, res }),
      })
    },
  }),
]
