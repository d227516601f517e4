// The fab sheet as a PDF (pdfkit, with the shipped IBM Plex Sans fonts from @fontsource): a to-scale drawing of
// the chip with a scale bar, layers and depths, mask polarity and resolution, process, smallest feature, design-
// rule findings, operating point, approver and release date, and the usual cautions.
import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { join } from 'node:path'
import { and, desc, eq } from 'drizzle-orm'
import PDFDocument from 'pdfkit'
import { buildOutlines } from '../../geometry/outlines'
import { checkDesignRules, revisionProcess } from '../../geometry/rules'
import { designs, fabOrders, releases, revisions, users, verdicts } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { findVisibleRevision } from './designGuards'
import { labLibraryData } from './libraries'
import { FAB_SHEET_CAUTIONS, lengthLabel, MASK_RESOLUTION_UM, scaleBarUm } from '#shared/fabrication/cautions'
import { measurableWidths } from '#shared/fabrication/asBuilt'
import {
  inletLine,
  locationLine,
  phasesLine,
  processLine,
  processSourceLine,
  storedLength,
} from '#shared/fabrication/fabSheet'
import { namedMessage } from '#shared/format/fieldLabels'
import { MASK_MEDIUM_LABELS, MASK_POLARITY_LABELS, SUBSTRATE_LABELS } from '#shared/fabrication/orderStatus'
import { chipDocument, type ChipDocument } from '#shared/schemas/chip'
import type { RevisionSummary } from '#shared/types/designs'

/** pdfkit reads TrueType, OpenType and WOFF (fontkit); the woff files ship in @fontsource/ibm-plex-sans. */
function fontFile(weight: 400 | 700): Buffer {
  const name = `@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-${weight}-normal.woff`
  try {
    return readFileSync(createRequire(join(process.cwd(), 'package.json')).resolve(name))
  } catch {
    return readFileSync(createRequire(import.meta.url).resolve(name))
  }
}

export async function fabSheetFacts(caller: LabCaller, revisionId: string) {
  const db = useDb()
  const head = await findVisibleRevision(db, caller, revisionId)
  const [row] = await db
    .select({ document: revisions.document, summary: revisions.summary, designName: designs.name })
    .from(revisions)
    .innerJoin(designs, eq(designs.id, revisions.designId))
    .where(eq(revisions.id, revisionId))
  const [release] = await db
    .select({ at: releases.releasedAt, by: users.name })
    .from(releases)
    .innerJoin(users, eq(users.id, releases.releasedBy))
    .where(eq(releases.revisionId, revisionId))
  const [order] = await db.select().from(fabOrders).where(eq(fabOrders.revisionId, revisionId))
  const [approval] = await db
    .select({ name: users.name, at: verdicts.createdAt })
    .from(verdicts)
    .innerJoin(users, eq(users.id, verdicts.reviewerId))
    .where(and(eq(verdicts.revisionId, revisionId), eq(verdicts.verdict, 'approve')))
    .orderBy(desc(verdicts.createdAt))
    .limit(1)
  const doc = chipDocument.parse(row!.document) as ChipDocument
  // The process the revision was checked with, as stored with it (a library edit after the release changes nothing);
  // only a summary kept before the snapshot existed looks its process up among the built-in ones and the lab's.
  const summary = row!.summary as unknown as RevisionSummary
  const process = revisionProcess(
    summary,
    summary.library?.process ? [] : (await labLibraryData(db, caller.lab.labId)).processes,
  )
  return {
    head,
    doc,
    designName: row!.designName,
    process,
    library: summary.library ?? null,
    release: release ?? null,
    order: order ?? null,
    approval: approval ?? null,
    labName: caller.lab.name,
  }
}

type Facts = Awaited<ReturnType<typeof fabSheetFacts>>
const day = (d: Date) => d.toISOString().slice(0, 10)

export function renderFabSheet(f: Facts): Promise<Buffer> {
  const pdf = new PDFDocument({
    size: 'A4',
    margin: 48,
    font: fontFile(400) as unknown as string,
    info: { Title: `Fab sheet ${f.designName} r${f.head.number}`, Author: f.labName, Creator: 'Dropwright' },
  })
  pdf.registerFont('regular', fontFile(400))
  pdf.registerFont('bold', fontFile(700))
  const chunks: Buffer[] = []
  pdf.on('data', (c: Buffer) => chunks.push(c))
  const done = new Promise<Buffer>(resolve => pdf.on('end', () => resolve(Buffer.concat(chunks))))
  const width = pdf.page.width - 96
  const heading = (text: string) => {
    pdf
      .moveDown(0.6)
      .font('bold')
      .fontSize(12)
      .fillColor('#16485b')
      .text(text)
      .font('regular')
      .fontSize(9.5)
      .fillColor('#1a2027')
  }

  pdf.font('bold').fontSize(18).fillColor('#1a2027').text(`${f.designName}  r${f.head.number}`)
  pdf.font('regular').fontSize(9.5).fillColor('#4a5866').text(`Fab sheet · ${f.labName} · Dropwright`)
  pdf
    .fillColor('#1a2027')
    .text(
      [
        f.release ? `Released ${day(f.release.at)} by ${f.release.by}` : `Status ${f.head.status} (not released)`,
        f.approval ? `approved by ${f.approval.name} on ${day(f.approval.at)}` : 'no approval recorded',
        f.order
          ? `order ${f.order.number}: ${f.order.quantity} chips, ${SUBSTRATE_LABELS[f.order.substrate]}${f.order.dueDate ? `, due ${f.order.dueDate}` : ''}${f.order.poNumber ? `, PO ${f.order.poNumber}` : ''}`
          : '',
      ]
        .filter(Boolean)
        .join('; ') + '.',
    )

  // The drawing, to scale: every layer's merged outlines inside the chip edge, with a scale bar.
  const outlines = buildOutlines(f.doc)
  const points = [...(outlines.chipOutline ?? []), ...outlines.layers.flatMap(l => l.polygons.flat(2))]
  if (points.length) {
    const xs = points.map(p => p[0])
    const ys = points.map(p => p[1])
    const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)]
    const scale = Math.min(width / (x1 - x0 || 1), 260 / (y1 - y0 || 1)) // pt per µm
    const top = pdf.y + 12
    const at = (p: [number, number] | number[]) => [48 + (p[0]! - x0) * scale, top + (y1 - p[1]!) * scale] as const // y up on the chip, down on paper
    const ring = (r: Array<[number, number] | number[]>) => {
      r.forEach((p, i) => (i ? pdf.lineTo(...at(p)) : pdf.moveTo(...at(p))))
      pdf.closePath()
    }
    if (outlines.chipOutline) {
      ring(outlines.chipOutline)
      pdf.lineWidth(0.6).stroke('#8595a3')
    }
    const shades = ['#1f6f8b', '#c47f0e', '#195a72', '#9f640b']
    outlines.layers.forEach((l, i) => {
      for (const poly of l.polygons) for (const r of poly) ring(r)
      pdf.fillColor(shades[i % shades.length]!).fill('even-odd')
    })
    const drawnHeight = (y1 - y0) * scale
    const bar = scaleBarUm(x1 - x0)
    const barY = top + drawnHeight + 14
    pdf
      .lineWidth(2)
      .moveTo(48, barY)
      .lineTo(48 + bar * scale, barY)
      .stroke('#1a2027')
    pdf
      .fillColor('#1a2027')
      .fontSize(8.5)
      .text(
        `${lengthLabel(bar)} (drawn to scale; chip ${lengthLabel(x1 - x0)} × ${lengthLabel(y1 - y0)})`,
        48 + bar * scale + 8,
        barY - 5,
      )
    pdf.x = 48
    pdf.y = barY + 10
    pdf.fontSize(9.5)
  }

  heading('Layers and depths')
  for (const l of f.doc.layers) pdf.text(`${l.name}: ${storedLength(l.depth)} deep (DXF layer CH-${l.depth}um)`)
  pdf.text('Drawing units: micrometres. Mirror the mask for the mould only if your process needs it.')

  heading('Mask')
  const medium = f.order?.maskMedium ?? 'film'
  pdf.text(
    `${MASK_MEDIUM_LABELS[medium]}; polarity: ${MASK_POLARITY_LABELS[f.order?.maskPolarity ?? 'positive'].toLowerCase()}.`,
  )
  pdf.text(`Mask resolution about ${storedLength(MASK_RESOLUTION_UM[medium])} (${medium}; common practice, no source).`)
  const smallest = Math.min(...measurableWidths(f.doc).map(w => w.designedUm))
  if (Number.isFinite(smallest))
    pdf.text(
      `Smallest feature drawn: ${storedLength(smallest)} wide${smallest < MASK_RESOLUTION_UM[medium] ? ' — finer than this mask resolves: use chrome' : ''}.`,
    )

  heading('Process')
  const p = f.process
  pdf.text(`${processLine(p)} (${processSourceLine(p)}).`)

  heading('Design-rule findings')
  const findings = checkDesignRules(f.doc, p)
  if (!findings.length) pdf.text('No findings.')
  for (const x of findings.slice(0, 30))
    pdf.text(`${x.severity}: ${namedMessage(f.doc as never, x.message)} (${locationLine(x.location)})`)
  if (findings.length > 30) pdf.text(`… and ${findings.length - 30} more (see the revision page).`)

  const op = f.doc.operatingPoints.find(o => o.id === f.doc.activeOperatingPoint) ?? f.doc.operatingPoints[0]
  if (op) {
    heading(`Operating point "${op.name}"`)
    pdf.text(`${phasesLine(op, f.library)}.`)
    for (const i of op.inlets) pdf.text(inletLine(i))
  }

  heading('Cautions')
  for (const c of FAB_SHEET_CAUTIONS) pdf.text(`•  ${c}`, { indent: 0 })
  pdf.end()
  return done
}
