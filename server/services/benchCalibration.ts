// The lab's calibration from its bench runs (per junction kind) and a design's forecast switch.
import { and, desc, eq } from 'drizzle-orm'
import {
  calibratedDiameterUm,
  calibrationKey,
  fitLabCalibrations,
  type CalibrationRun,
} from '#shared/physics/calibration/lab'
import { designForecastModes, revisions } from '../db/schema'
import type { LabCaller } from '../utils/access'
import { useDb } from '../utils/db'
import { labRunsForCalibration } from './bench'
import type { RunPrediction } from './benchForecast'
import type { RevisionSummary } from '#shared/types/designs'
import { findDesign } from './designGuards'

async function calibrationsOf(caller: LabCaller) {
  const runs = await labRunsForCalibration(caller)
  const points: CalibrationRun[] = runs.flatMap(run => {
    const p = run.predicted as RunPrediction | null
    if (!p || run.meanUm === null) return []
    return [
      {
        id: run.id,
        kind: p.kind,
        ranAt: run.ranAt.toISOString(),
        measuredUm: run.meanUm,
        quantity: run.quantity as 'diameter' | 'plug-length',
        predictedDiameterUm: p.diameterUm,
        flowRatio: p.flowRatio,
        mainWidthUm: p.mainWidthUm,
        depthUm: p.depthUm,
        regime: p.regime,
      },
    ]
  })
  return fitLabCalibrations(points)
}

export async function labCalibrations(caller: LabCaller, designId?: string) {
  const calibrations = await calibrationsOf(caller)
  if (!designId) return { calibrations, design: null }
  const db = useDb()
  const design = await findDesign(db, caller, designId)
  const [mode] = await db.select().from(designForecastModes).where(eq(designForecastModes.designId, designId))
  const [latest] = await db
    .select({ id: revisions.id, summary: revisions.summary })
    .from(revisions)
    .where(and(eq(revisions.designId, designId), eq(revisions.labId, caller.lab.labId)))
    .orderBy(desc(revisions.number))
    .limit(1)
  // Per junction of this design's runs: the model's size is the latest revision's own forecast at its operating
  // point (a run's prediction may be at the flows set at the bench); the calibration is applied to it at the design's
  // flow ratio, with the junction sizes kept with the run.
  const runs = (await labRunsForCalibration(caller)).filter(r => r.designId === designId && r.predicted)
  const designed = new Map(
    ((latest?.summary as RevisionSummary | undefined)?.junctions ?? []).map(j => [j.id, j.dropletDiameterUm]),
  )
  const junctions = runs.length
    ? [
        ...new Map(
          runs.map(r => [
            (r.predicted as unknown as RunPrediction).junctionId,
            r.predicted as unknown as RunPrediction,
          ]),
        ).values(),
      ].map(p => {
        const calibration = calibrations.find(c => c.kind === calibrationKey(p.kind, p.regime))
        const model = designed.get(p.junctionId) ?? p.diameterUm
        return {
          junctionId: p.junctionId,
          kind: calibrationKey(p.kind, p.regime),
          modelDiameterUm: model,
          calibrated: calibration
            ? calibratedDiameterUm(calibration, {
                predictedDiameterUm: model,
                flowRatio: p.forecastFlowRatio,
                mainWidthUm: p.mainWidthUm,
                depthUm: p.depthUm,
              })
            : null,
        }
      })
    : []
  return {
    calibrations,
    design: {
      id: design.id,
      mode: mode?.mode ?? 'model',
      changedAt: mode?.changedAt.toISOString() ?? null,
      latestRevisionId: latest?.id ?? null,
      junctions,
    },
  }
}

export async function setForecastMode(caller: LabCaller, designId: string, mode: 'model' | 'lab-calibrated') {
  const db = useDb()
  await findDesign(db, caller, designId)
  await db
    .insert(designForecastModes)
    .values({ designId, labId: caller.lab.labId, mode, changedBy: caller.userId })
    .onConflictDoUpdate({
      target: designForecastModes.designId,
      set: { mode, changedBy: caller.userId, changedAt: new Date() },
    })
  return { designId, mode }
}
