// Worker-thread task of the micrograph measurement (bundled to .output/server/workers/imaging.mjs by
// scripts/build-workers.mjs): grey pixels in, detected drops out. The pixels arrive as a transferred buffer.
import { setPriority } from 'node:os'
import { measureDrops, type Measurement } from '#shared/imaging/measure'
import { useConfig } from '../utils/config'

// Below the request thread, like the geometry workers (a nice value is per thread on Linux): a measurement of
// several seconds waits for the event loop that answers requests (DW_GEOMETRY_NICE, default 10).
try {
  setPriority(useConfig().geometry.nice)
} catch {
  /* not allowed here: run at the same priority */
}

export default function measure(job: {
  width: number
  height: number
  pixels: ArrayBuffer
  umPerPx: number
}): Measurement {
  return measureDrops(
    { width: job.width, height: job.height, data: new Uint8Array(job.pixels) },
    { umPerPx: job.umPerPx },
  )
}
