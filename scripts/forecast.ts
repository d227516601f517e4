// `npm run --silent forecast < request.json`: prints the forecast answer as JSON.
// Exit code 2 with one line on stderr naming the bad field when the request is invalid.
import { ForecastInputError, runForecast } from '../shared/physics/forecast'
import { readStdin } from './lib/cli'

const text = await readStdin()
let request: unknown
try {
  request = JSON.parse(text)
} catch (error) {
  process.stderr.write(
    `invalid request: not JSON (${(error as Error).message}); pipe a JSON file, e.g. npm run --silent forecast < request.json\n`,
  )
  process.exit(2)
}
try {
  process.stdout.write(`${JSON.stringify(runForecast(request), null, 2)}\n`)
} catch (error) {
  if (error instanceof ForecastInputError) {
    process.stderr.write(
      `invalid request: ${error.issues.map(issue => `${issue.path || '(request)'}: ${issue.message}`).join('; ')}\n`,
    )
    process.exit(2)
  }
  throw error
}
