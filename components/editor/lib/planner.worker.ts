// The planner's window scan off the main thread: a scan is hundreds of whole-chip forecasts (a pressure-driven
// chip solves its network at every point), so in the page it would hold up the editor for seconds.
import { runPlanRequest, type PlanJob } from '../../../utils/plannerRun'

self.onmessage = (e: MessageEvent<PlanJob>) => {
  self.postMessage(runPlanRequest(e.data))
}
