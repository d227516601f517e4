// Micrograph measurement: a 2048 × 2048 px synthetic micrograph with 500 drops, measured by the product's detection
// (shared/imaging/measure.ts, on image-js), against the same threshold + connected components done with OpenCV
// compiled to WebAssembly (@techstark/opencv-js), the alternative the choice was made against.
import { createRequire } from 'node:module'
import { measureDrops } from '../../shared/imaging/measure'
import { renderMicrograph, scatterDrops } from '../../shared/imaging/synthetic'
import { describeSample } from '../../shared/physics/calibration/stats'
import { bestOf } from './timing'

export async function run() {
  const size = 2048
  const { separated } = scatterDrops({ width: size, height: size, count: 500, meanDiameter: 40, cv: 0.05, seed: 5 })
  const image = renderMicrograph({
    width: size,
    height: size,
    drops: separated,
    noise: 5,
    blur: 1,
    unevenness: 0.3,
    seed: 5,
  })
  const truth = describeSample(separated.map(d => d.diameter))
  let result = measureDrops(image, { umPerPx: 1 })
  const ms = await bestOf(3, () => {
    result = measureDrops(image, { umPerPx: 1 })
  })
  const accepted = result.drops.filter(d => d.accepted)
  console.log(
    `[imaging] ${size}×${size} px, ${separated.length} drops: image-js pipeline ${ms.toFixed(0)} ms (budget 2000 ms), ` +
      `${accepted.length} accepted, mean ${result.summary!.mean.toFixed(2)} px vs ${truth.mean.toFixed(2)} drawn (${(100 * (result.summary!.mean / truth.mean - 1)).toFixed(2)} %), ` +
      `CV ${(100 * result.summary!.cv).toFixed(2)} % vs ${(100 * truth.cv).toFixed(2)} %`,
  )

  // OpenCV.js: Otsu threshold + connectedComponentsWithStats only (no flat field, no hole fill, no refinement).
  try {
    const require = createRequire(import.meta.url)
    const t0 = performance.now()
    const cvModule = require('@techstark/opencv-js')
    // The module is a thenable that resolves to itself: wait for its runtime, then hand it on wrapped (never resolve a
    // promise with it, which would loop).
    const { cv } = await new Promise<{ cv: any }>(resolve => {
      if (cvModule.Mat) resolve({ cv: cvModule })
      else cvModule.onRuntimeInitialized = () => resolve({ cv: cvModule })
    })
    const load = performance.now() - t0
    const cvMs = await bestOf(3, () => {
      const src = cv.matFromArray(size, size, cv.CV_8UC1, image.data)
      const bin = new cv.Mat()
      cv.threshold(src, bin, 0, 255, cv.THRESH_BINARY_INV + cv.THRESH_OTSU)
      const labels = new cv.Mat()
      const stats = new cv.Mat()
      const centroids = new cv.Mat()
      const n = cv.connectedComponentsWithStats(bin, labels, stats, centroids, 4, cv.CV_32S)
      ;[src, bin, labels, stats, centroids].forEach(m => m.delete())
      return n
    })
    console.log(
      `[imaging] OpenCV.js threshold + components only: ${cvMs.toFixed(0)} ms, plus ${load.toFixed(0)} ms to load its 10 MB WebAssembly once`,
    )
  } catch (error) {
    console.log(`[imaging] OpenCV.js not measured: ${(error as Error).message}`)
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await run()
