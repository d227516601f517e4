// `npm run --silent plan [-- --process-file=processes.json] < request.json`: prints the plan (window, recommended
// point, geometry, loading) as JSON. Exit code 2 with one line on stderr naming each bad field when the request is
// invalid (docs/planner.md). `--process-file`: the lab's own processes (a JSON list, as GET /api/v1/liquids?lab=
// gives them under labData.processes), which `process` may then name; otherwise the built-in processes only.
import { readFileSync } from 'node:fs'
import { z } from 'zod'
import { LAB_PROCESS_ID, type LabProcessData } from '../geometry/rules/processes'
import { ForecastInputError } from '../shared/physics/forecast'
import { runPlan } from '../shared/physics/planner'
import { labProcessValues } from '../shared/schemas/libraries'
import { fail, readStdin } from './lib/cli'

/** The lab's processes from `--process-file`, each checked as the Libraries page checks it; exit 2 naming the field. */
function processFile(): LabProcessData[] | null {
  const path = process.argv
    .slice(2)
    .find(a => a.startsWith('--process-file='))
    ?.slice('--process-file='.length)
  if (path === undefined) return null
  let json: unknown
  try {
    json = JSON.parse(readFileSync(path, 'utf8'))
  } catch (error) {
    fail([`--process-file: cannot read "${path}" as JSON (${(error as Error).message})`])
  }
  const entry = z.looseObject({
    id: z.string().regex(LAB_PROCESS_ID, 'id: "lab-" and a short id, e.g. "lab-fine-su8"'),
  })
  const list = z.array(entry, { error: 'a JSON list of processes' }).max(300).safeParse(json)
  if (!list.success) fail([`--process-file: ${list.error.issues[0]!.message}`])
  return list.data.map(({ id, ...values }, i) => {
    const checked = labProcessValues.safeParse(values)
    if (!checked.success)
      fail(checked.error.issues.map(issue => `--process-file: [${i}].${issue.path.join('.')}: ${issue.message}`))
    return { id, ...checked.data }
  })
}

const processes = processFile()
const text = await readStdin()
let request: unknown
try {
  request = JSON.parse(text)
} catch (error) {
  process.stderr.write(
    `invalid request: not JSON (${(error as Error).message}); pipe a JSON file, e.g. npm run --silent plan < request.json\n`,
  )
  process.exit(2)
}
try {
  process.stdout.write(
    `${JSON.stringify(runPlan(request, { lab: processes ? { liquids: [], pairs: [], processes } : null }), null, 2)}\n`,
  )
} catch (error) {
  if (error instanceof ForecastInputError) {
    process.stderr.write(
      `invalid request: ${error.issues.map(issue => `${issue.path || '(request)'}: ${issue.message}`).join('; ')}\n`,
    )
    process.exit(2)
  }
  throw error
}
