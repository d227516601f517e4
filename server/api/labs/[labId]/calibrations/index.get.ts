import { calibrationQuery } from '#shared/schemas/bench'
import { labParams } from '#shared/schemas/labs'
import { requireBenchCaller } from '../../../../services/bench'
import { labCalibrations } from '../../../../services/benchCalibration'
import { validParams, validQuery } from '../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId } = validParams(event, labParams)
  const caller = requireBenchCaller(event, labId)
  const { designId } = validQuery(event, calibrationQuery)
  return labCalibrations(caller, designId)
})
