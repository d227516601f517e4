// The imaging process (a tinypool child process, bundled to .output/server/workers/imaging.mjs by
// scripts/build-workers.mjs): micrograph uploads parsed, checked and stored, and stored micrographs measured, off
// the server's process. A process rather than a thread because everything image work starts — libvips' threads,
// the thread pool that runs sharp, the garbage collector's helpers — then runs below the request thread too.
import { readdirSync } from 'node:fs'
import { setPriority } from 'node:os'
import {
  measureStoredMicrograph,
  storeMicrographUpload,
  type MeasureMicrographTask,
  type StoreMicrographTask,
} from '../services/micrographWork'
import { useConfig } from '../utils/config'
import { settle } from '../utils/settle'

// A nice value is per thread on Linux: every thread that exists now gets DW_GEOMETRY_NICE (default 10), and the
// threads started later inherit it from the thread that starts them.
const nice = useConfig().geometry.nice
try {
  for (const tid of readdirSync('/proc/self/task')) setPriority(Number(tid), nice)
} catch {
  try {
    setPriority(nice)
  } catch {
    /* not allowed here: run at the same priority */
  }
}

export const store = (task: StoreMicrographTask) => settle(() => storeMicrographUpload(task))
export const measure = (task: MeasureMicrographTask) => settle(() => measureStoredMicrograph(task))
