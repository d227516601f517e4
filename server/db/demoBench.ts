// Demo bench results: the lab's released T-junction gets two runs — one typed, one from a synthetic micrograph the
// seed draws (shared/imaging/synthetic.ts), stored in object storage and measured like an upload. Idempotent.
import { randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import sharp from 'sharp'
import { measureDrops } from '../../shared/imaging/measure'
import { renderMicrograph, scatterDrops } from '../../shared/imaging/synthetic'
import { plugDiameterUm } from '../../shared/physics/calibration/lab'
import { describeSample } from '../../shared/physics/calibration/stats'
import { plugLength, sphereVolume } from '../../shared/physics/junction/plugVolume'
import type { Metres } from '../../shared/physics/units'
import { predictRun } from '../services/benchForecast'
import { objectKey, putObject } from '../services/storage'
import type { Db } from '../utils/db'
import { benchMicrographs, benchRuns, revisions } from './schema'

export async function seedDemoBench(db: Db, labId: string, people: { designer: string; experimenter: string }) {
  const released = await db
    .select({ id: revisions.id, designId: revisions.designId, document: revisions.document })
    .from(revisions)
    .where(and(eq(revisions.labId, labId), eq(revisions.status, 'released')))
  const target = released.find(r => JSON.stringify(r.document).includes('"t-junction"'))
  if (!target) return 0
  const existing = await db.select({ id: benchRuns.id }).from(benchRuns).where(eq(benchRuns.revisionId, target.id))
  if (existing.length) return existing.length
  const opId = (target.document as { operatingPoints?: { id: string }[] }).operatingPoints?.[0]?.id
  // The demo chip has no as-built report: its runs are forecast on the chip as drawn, and say so.
  const asDrawn = { basis: 'as-drawn', asBuiltId: null, reportedAt: null, benchSizes: false } as const
  const onDrawn = (p: Awaited<ReturnType<typeof predictRun>>) =>
    (p ? { ...p, chip: asDrawn } : null) as unknown as Record<string, unknown> | null
  const predicted = await predictRun(target.document, opId, undefined, {})
  const base = {
    labId,
    designId: target.designId,
    revisionId: target.id,
    operatingPointId: opId ?? null,
    junctionId: predicted?.junctionId ?? null,
    predicted: onDrawn(predicted),
  }

  // The lab's "true" chip: drops 12 % above the forecast at the design's flow ratio, on the line L/w = 1 + α Qd/Qc.
  const w = predicted?.mainWidthUm ?? 100
  const h = predicted?.depthUm ?? 50
  const x1 = predicted?.forecastFlowRatio ?? 0.2
  const targetUm = (predicted ? predicted.diameterUm : 60) * 1.12
  const alpha =
    ((plugLength(sphereVolume((targetUm * 1e-6) as Metres), (w * 1e-6) as Metres, (h * 1e-6) as Metres) * 1e6) / w -
      1) /
    x1

  // Typed: twelve drops measured by hand at half the dispersed flow (the ratio typed as the bench's flows).
  const x2 = x1 / 2
  const atHalf = plugDiameterUm(w * (1 + alpha * x2), w, h)
  const typed = [0.99, 1.01, 1.0, 0.98, 1.02, 1.0, 1.01, 0.99, 1.0, 1.02, 0.98, 1.0].map(f => +(atHalf * f).toFixed(1))
  const s = describeSample(typed)
  const halfConditions = {
    continuousFlow: { value: 10, unit: 'uL/min' as const },
    dispersedFlow: { value: +(10 * x2).toPrecision(4), unit: 'uL/min' as const },
  }
  const halfPrediction = await predictRun(target.document, opId, undefined, halfConditions)
  await db.insert(benchRuns).values({
    ...base,
    predicted: onDrawn(halfPrediction),
    conditions: halfConditions,
    quantity: 'diameter',
    source: 'typed',
    valuesUm: typed,
    count: s.count,
    meanUm: s.mean,
    sdUm: s.sd,
    cv: s.cv,
    notes: 'Demo: measured by hand on the first chip of the batch, at half the dispersed flow (invented data).',
    ranBy: people.experimenter,
    ranAt: new Date(Date.now() - 3 * 86_400_000),
  })

  // Micrograph: 60 drops about 12 % above the forecast, drawn at 0.8 µm per pixel.
  const umPerPx = 0.8
  const diameterPx = targetUm / umPerPx
  const size = 1024
  const { separated } = scatterDrops({
    width: size,
    height: size,
    count: Math.min(60, Math.floor((size / (diameterPx * 1.6)) ** 2 * 0.5)),
    meanDiameter: diameterPx,
    cv: 0.025,
    seed: 11,
  })
  const image = renderMicrograph({
    width: size,
    height: size,
    drops: separated,
    noise: 4,
    blur: 0.9,
    unevenness: 0.3,
    seed: 11,
  })
  const png = new Uint8Array(
    await sharp(Buffer.from(image.data), { raw: { width: size, height: size, channels: 1 } })
      .png()
      .toBuffer(),
  )
  const measurement = measureDrops(image, { umPerPx })
  const values = measurement.drops.filter(d => d.accepted).map(d => d.diameterUm)
  const m = describeSample(values)
  const [run] = await db
    .insert(benchRuns)
    .values({
      ...base,
      conditions: {},
      quantity: 'diameter',
      source: 'micrograph',
      valuesUm: values,
      count: m.count,
      meanUm: m.mean,
      sdUm: m.sd,
      cv: m.cv,
      notes: 'Demo: a synthetic micrograph drawn by the seed.',
      ranBy: people.designer,
      ranAt: new Date(Date.now() - 86_400_000),
    })
    .returning({ id: benchRuns.id })
  const id = randomUUID()
  const key = objectKey(labId, 'micrographs', id, 'original')
  await putObject(key, png, 'image/png')
  await putObject(objectKey(labId, 'micrographs', id, 'view.png'), png, 'image/png')
  const thumb = objectKey(labId, 'micrographs', id, 'thumbnail.jpg')
  await putObject(
    thumb,
    new Uint8Array(await sharp(png).resize({ width: 320 }).jpeg({ quality: 80 }).toBuffer()),
    'image/jpeg',
  )
  await db.insert(benchMicrographs).values({
    id,
    labId,
    runId: run!.id,
    objectKey: key,
    thumbnailKey: thumb,
    contentType: 'image/png',
    bytes: png.byteLength,
    fileName: 'demo-micrograph.png',
    width: size,
    height: size,
    umPerPx,
    status: 'done',
    progress: 1,
    measurement: measurement as unknown as Record<string, unknown>,
    createdBy: people.designer,
  })
  return 2
}
