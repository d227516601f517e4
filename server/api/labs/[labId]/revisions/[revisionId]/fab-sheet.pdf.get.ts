import { revisionParams } from '#shared/schemas/designs'
import { fabSheetFacts, renderFabSheet } from '../../../../../services/fabSheetPdf'
import { requireLabPermission } from '../../../../../utils/access'
import { validParams } from '../../../../../utils/validate'

export default defineEventHandler(async event => {
  const { labId, revisionId } = validParams(event, revisionParams)
  const caller = requireLabPermission(event, labId, 'released:view')
  const facts = await fabSheetFacts(caller, revisionId)
  const pdf = await renderFabSheet(facts)
  const file = `${
    facts.designName
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '') || 'chip'
  }_r${facts.head.number}_fab-sheet.pdf`
  setResponseHeader(event, 'content-type', 'application/pdf')
  setResponseHeader(event, 'content-disposition', `attachment; filename="${file}"`)
  return pdf
})
