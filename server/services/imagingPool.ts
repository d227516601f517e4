// The imaging process (server/workers/imaging.ts), one child process started on the first micrograph and stopped
// after 30 s idle; without a built worker (tests of the sources, DW_IMAGING_WORKER=0) the same work runs here.
import Tinypool from 'tinypool'
import { useConfig } from '../utils/config'
import { settle, unsettle, type Settled } from '../utils/settle'
import { builtWorkerFile } from '../utils/workerFile'
import {
  measureStoredMicrograph,
  storeMicrographUpload,
  type MeasureMicrographTask,
  type StoreMicrographTask,
} from './micrographWork'

const tasks = { store: storeMicrographUpload, measure: measureStoredMicrograph }
type Tasks = typeof tasks

let pool: Tinypool | null | undefined
function imagingPool(): Tinypool | null {
  if (pool !== undefined) return pool
  const file = builtWorkerFile('imaging')
  pool =
    file && useConfig().imaging.worker
      ? new Tinypool({
          filename: file,
          runtime: 'child_process',
          // Typed arrays cross as bytes, not as JSON.
          serialization: 'advanced',
          env: process.env as Record<string, string>,
          execArgv: ['--max-old-space-size=1024'],
          minThreads: 0,
          maxThreads: 1,
          idleTimeout: 30_000,
        })
      : null
  return pool
}

/** Runs one imaging task in the imaging process; its HTTP errors come back as they were raised. */
export async function runImaging<K extends keyof Tasks>(
  name: K,
  task: Parameters<Tasks[K]>[0],
  timeoutMs = 120_000,
): Promise<Awaited<ReturnType<Tasks[K]>>> {
  const p = imagingPool()
  const settled = (
    p
      ? await p.run(task, { name, signal: AbortSignal.timeout(timeoutMs) })
      : await settle(() => (tasks[name] as (t: typeof task) => Promise<unknown>)(task))
  ) as Settled<Awaited<ReturnType<Tasks[K]>>>
  return unsettle(settled)
}

export type { MeasureMicrographTask, StoreMicrographTask }
