// `npm run --silent dxf [-- --mirror] [-- --layers=CH-50um,OUTLINE] [-- --revision=r3] < document.json > chip.dxf`
// Writes the chip's mask DXF (µm, one layer per depth) to stdout. Exit 2 with a message naming the element on bad input.
import { parseChipDocument } from '#shared/schemas/chip'
import { exportDxf } from '~~/geometry/dxf'
import { buildOutlines } from '~~/geometry/outlines'

async function readStdin(): Promise<string> {
  const chunks: Buffer[] = []
  for await (const c of process.stdin) chunks.push(c as Buffer)
  return Buffer.concat(chunks).toString('utf8')
}

function fail(lines: string[]): never {
  for (const l of lines) process.stderr.write(`${l}\n`)
  process.exit(2)
}

const args = process.argv.slice(2)
const flag = (name: string) => args.find((a) => a.startsWith(`--${name}=`))?.slice(name.length + 3)
const unknown = args.filter((a) => !/^--(mirror|layers=.*|revision=.*|date=.*)$/.test(a))
if (unknown.length > 0) fail([`Unknown option ${unknown[0]}: use --mirror, --layers=a,b, --revision=r, --date=YYYY-MM-DD`])

let json: unknown
try {
  json = JSON.parse(await readStdin())
} catch (e) {
  fail([`Input is not JSON (${(e as Error).message}): pipe a chip document on stdin`])
}
const parsed = parseChipDocument(json)
if (!parsed.ok) fail(parsed.errors.map((e) => e.message))
const outlines = buildOutlines(parsed.document)
if (outlines.problems.length > 0) fail(outlines.problems.map((p) => p.message))
const layers = flag('layers')?.split(',').map((s) => s.trim()).filter(Boolean)
process.stdout.write(exportDxf(parsed.document, {
  mirror: args.includes('--mirror'), layers, revision: flag('revision'), date: flag('date'), outlines,
}))
