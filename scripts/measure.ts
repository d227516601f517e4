// Measures the droplets of a micrograph from standard input and prints the detected drops and their distribution
// as JSON (the same detection as the server's micrograph upload, shared/imaging/measure.ts).
//
//   npm run --silent measure -- --um-per-px 0.8 < image.png
//
// Exit 2 with a message on standard error when the input is not a PNG, JPEG or TIFF image, or the scale is missing.
import { fileTypeFromBuffer } from 'file-type'
import sharp from 'sharp'
import { measureDrops } from '../shared/imaging/measure'
import { MAX_MICROGRAPH_PIXELS, MICROGRAPH_TYPES } from '../shared/schemas/bench'

function fail(message: string): never {
  process.stderr.write(`measure: ${message}\n`)
  process.exit(2)
}

const args = process.argv.slice(2)
const at = args.indexOf('--um-per-px')
const umPerPx = at >= 0 ? Number(args[at + 1]) : Number.NaN
if (!(umPerPx > 0)) fail('give the scale: --um-per-px 0.8 (micrometres per pixel, > 0)')

const chunks: Buffer[] = []
for await (const chunk of process.stdin) chunks.push(chunk as Buffer)
const bytes = Buffer.concat(chunks)
if (bytes.length === 0) fail('no image on standard input: npm run --silent measure -- --um-per-px 0.8 < image.png')
const type = await fileTypeFromBuffer(bytes)
if (!type || !(MICROGRAPH_TYPES as readonly string[]).includes(type.mime)) {
  fail(
    `standard input is ${type ? `a ${type.ext.toUpperCase()} file (${type.mime})` : 'not an image'}, not a PNG, JPEG or TIFF micrograph`,
  )
}
let decoded
try {
  decoded = await sharp(bytes, { limitInputPixels: MAX_MICROGRAPH_PIXELS })
    .greyscale()
    .toColourspace('b-w')
    .raw()
    .toBuffer({ resolveWithObject: true })
} catch (error) {
  fail(`the image could not be decoded (${error instanceof Error ? error.message : error})`)
}
const started = performance.now()
const result = measureDrops(
  { width: decoded.info.width, height: decoded.info.height, data: new Uint8Array(decoded.data) },
  { umPerPx },
)
const out = {
  image: { type: type.mime, width: result.width, height: result.height, umPerPx },
  method: result.method,
  summary: result.summary && { ...result.summary, unit: 'µm' },
  accepted: result.drops.filter(d => d.accepted).length,
  rejected: result.drops.filter(d => !d.accepted).length,
  drops: result.drops.map(d => ({
    ...d,
    x: +d.x.toFixed(2),
    y: +d.y.toFixed(2),
    diameterPx: +d.diameterPx.toFixed(3),
    diameterUm: +d.diameterUm.toFixed(3),
  })),
  ms: Math.round(performance.now() - started),
}
process.stdout.write(`${JSON.stringify(out, null, 2)}\n`)
