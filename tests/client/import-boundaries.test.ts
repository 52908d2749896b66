import { describe, expect, it } from 'vitest'
import { ESLint } from 'eslint'

// The folder rules in eslint.config.js, checked by linting a line of code as if it stood in a file
// there (common practice, no source): the layers in src/README.md and the bans in DEVELOPERS.md.
const eslint = new ESLint()
async function refused(filePath: string, from: string): Promise<string[]> {
  const [result] = await eslint.lintText(`import { x } from '${from}'\nexport const y = x\n`, { filePath })
  return result.messages.filter((m) => m.ruleId === 'no-restricted-imports').map((m) => m.message)
}
/** The zod ban: a line of imports as if it stood in `filePath`, and what the rule refuses. */
async function zodRefused(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(`${code}\nexport type Y = unknown\n`, { filePath })
  return result.messages
    .filter((m) => m.ruleId === '@typescript-eslint/no-restricted-imports')
    .map((m) => m.message)
}

// Loading the lint config takes seconds on a busy machine; this is no speed check.
describe('import boundaries', { timeout: 60_000 }, () => {
  it('keeps the outbox and the HTTP client below the screens', async () => {
    expect(await refused('src/offline/probe.ts', '../components/visit/visit-draft')).toHaveLength(1)
    expect(await refused('src/offline/probe.ts', '../pages/visit/use-visit-form')).toHaveLength(1)
    expect(await refused('src/api/probe.ts', '../components/common/csv')).toHaveLength(1)
    expect(await refused('src/api/probe.ts', '../pages/map/use-basemap')).toHaveLength(1)
    // Downwards is fine.
    expect(await refused('src/offline/probe.ts', '../api/http')).toEqual([])
    expect(await refused('src/pages/visit/probe.ts', '../../components/visit/visit-draft')).toEqual([])
  })

  it('still keeps the demo seed out of the app, the outbox included', async () => {
    expect(await refused('src/offline/probe.ts', '../../seeds/demo/accounts')).toHaveLength(1)
    expect(await refused('src/stores/probe.ts', '../../seeds/demo/accounts')).toHaveLength(1)
    expect(await refused('server/services/probe.ts', '../../seeds/demo/index')).toHaveLength(1)
  })

  it('keeps shared/ free of client and server code', async () => {
    expect(await refused('shared/probe.ts', '../server/db')).toHaveLength(1)
    expect(await refused('shared/probe.ts', '../src/dates')).toHaveLength(1)
  })

  it('keeps zod and the schema modules out of the screens but for their types (issue 14)', async () => {
    const schema = `import { seasonStateSchema } from '../../../shared/schemas/season'\nvoid seasonStateSchema`
    expect(await zodRefused('src/components/season/probe.ts', schema)).toHaveLength(1)
    expect(await zodRefused('src/pages/run/probe.ts', `import { z } from 'zod'\nvoid z`)).toHaveLength(1)
    expect(await zodRefused('shared/vocab/probe.ts', `import { z } from 'zod'\nvoid z`)).toHaveLength(1)
    // Types cost nothing at run time; the words come from shared/vocab; the schemas build on zod.
    const types = `import type { z } from 'zod'\nimport type { seasonGlance } from '../../../shared/schemas/season'`
    expect(await zodRefused('src/components/season/probe.ts', types)).toEqual([])
    const words = `import { seasonStates } from '../../../shared/vocab/season'\nvoid seasonStates`
    expect(await zodRefused('src/components/season/probe.ts', words)).toEqual([])
    expect(await zodRefused('shared/schemas/probe.ts', `import { z } from 'zod'\nvoid z`)).toEqual([])
  })
})
