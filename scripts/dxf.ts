// `npm run --silent dxf [-- --mirror] [-- --text=outline|font] [-- --layers=CH-50um,OUTLINE] [-- --revision=r3] < document.json > chip.dxf`
// Writes the chip's mask DXF (µm, one layer per depth; text as closed outlines, or TEXT entities with --text=font) to stdout. Exit 2 with a message naming the element on bad input.
import { fail, readChipDocument } from './lib/cli'
import { exportDxf } from '~~/geometry/dxf'
import { buildOutlines } from '~~/geometry/outlines'
import { dxfQuery } from '#shared/schemas/designs'
import { labelFont } from '~~/server/utils/labelFont'

const args = process.argv.slice(2)
const flag = (name: string) => args.find(a => a.startsWith(`--${name}=`))?.slice(name.length + 3)
const unknown = args.filter(a => !/^--(mirror|layers=.*|revision=.*|date=.*|text=.*)$/.test(a))
if (unknown.length > 0)
  fail([
    `Unknown option ${unknown[0]}: use --mirror, --layers=a,b, --text=outline|font, --revision=r, --date=YYYY-MM-DD`,
  ])

const textOption = dxfQuery.shape.text.safeParse(flag('text'))
if (!textOption.success) fail([textOption.error.issues[0]?.message ?? 'Text must be "outline" or "font"'])
const text = textOption.data ?? 'outline'
const document = await readChipDocument()
const outlines = buildOutlines(document)
if (outlines.problems.length > 0) fail(outlines.problems.map(p => p.message))
const layers = flag('layers')
  ?.split(',')
  .map(s => s.trim())
  .filter(Boolean)
process.stdout.write(
  exportDxf(document, {
    mirror: args.includes('--mirror'),
    layers,
    revision: flag('revision'),
    date: flag('date'),
    outlines,
    text,
    font: text === 'font' ? undefined : labelFont(),
  }),
)
