// `npm run --silent plan < request.json`: prints the plan (window, recommended point, geometry, loading) as JSON.
// Exit code 2 with one line on stderr naming each bad field when the request is invalid (docs/planner.md).
import { ForecastInputError } from '../shared/physics/forecast'
import { runPlan } from '../shared/physics/planner'
import { readStdin } from './lib/cli'

const text = await readStdin()
let request: unknown
try {
  request = JSON.parse(text)
} catch (error) {
  process.stderr.write(`invalid request: not JSON (${(error as Error).message}); pipe a JSON file, e.g. npm run --silent plan < request.json\n`)
  process.exit(2)
}
try {
  process.stdout.write(`${JSON.stringify(runPlan(request), null, 2)}\n`)
} catch (error) {
  if (error instanceof ForecastInputError) {
    process.stderr.write(`invalid request: ${error.issues.map((issue) => `${issue.path || '(request)'}: ${issue.message}`).join('; ')}\n`)
    process.exit(2)
  }
  throw error
}
