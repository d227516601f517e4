import { forecastModeBody } from '#shared/schemas/bench'
import { labParams } from '#shared/schemas/labs'
import { requireLabPermission } from '../../../../utils/access'
import { setForecastMode } from '../../../../services/benchCalibration'
import { validBody, validParams } from '../../../../utils/validate'

// Which forecast a design shows: "model" or "lab-calibrated". Designers (designs:edit) choose.
export default defineEventHandler(async event => {
  const { labId } = validParams(event, labParams)
  const caller = requireLabPermission(event, labId, 'designs:edit')
  const { designId, mode } = await validBody(event, forecastModeBody)
  return setForecastMode(caller, designId, mode)
})
