// Worker-thread task of the micrograph measurement (bundled to .output/server/workers/imaging.mjs by
// scripts/build-workers.mjs): grey pixels in, detected drops out. The pixels arrive as a transferred buffer.
import { measureDrops, type Measurement } from '#shared/imaging/measure'

export default function measure(job: { width: number, height: number, pixels: ArrayBuffer, umPerPx: number }): Measurement {
  return measureDrops({ width: job.width, height: job.height, data: new Uint8Array(job.pixels) }, { umPerPx: job.umPerPx })
}
