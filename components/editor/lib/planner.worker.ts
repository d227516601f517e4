// The planner's window scan off the main thread: a scan is hundreds of whole-chip forecasts (a pressure-driven
// chip solves its network at every point), so in the page it would hold up the editor for seconds. Called from the
// page through comlink (composables/usePlanner.ts).
import { expose } from 'comlink'
import { runPlanRequest } from '../../../utils/plannerRun'

expose({ plan: runPlanRequest })
