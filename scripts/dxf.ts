// `npm run --silent dxf [-- --mirror] [-- --layers=CH-50um,OUTLINE] [-- --revision=r3] < document.json > chip.dxf`
// Writes the chip's mask DXF (µm, one layer per depth) to stdout. Exit 2 with a message naming the element on bad input.
import { fail, readChipDocument } from './lib/cli'
import { exportDxf } from '~~/geometry/dxf'
import { buildOutlines } from '~~/geometry/outlines'

const args = process.argv.slice(2)
const flag = (name: string) => args.find((a) => a.startsWith(`--${name}=`))?.slice(name.length + 3)
const unknown = args.filter((a) => !/^--(mirror|layers=.*|revision=.*|date=.*)$/.test(a))
if (unknown.length > 0) fail([`Unknown option ${unknown[0]}: use --mirror, --layers=a,b, --revision=r, --date=YYYY-MM-DD`])

const document = await readChipDocument()
const outlines = buildOutlines(document)
if (outlines.problems.length > 0) fail(outlines.problems.map((p) => p.message))
const layers = flag('layers')?.split(',').map((s) => s.trim()).filter(Boolean)
process.stdout.write(exportDxf(document, {
  mirror: args.includes('--mirror'), layers, revision: flag('revision'), date: flag('date'), outlines,
}))
