import { summaryWorkerRunning } from '../utils/summaryWorker'

export default defineEventHandler(() => ({ ok: true, summaryWorker: summaryWorkerRunning() }))
