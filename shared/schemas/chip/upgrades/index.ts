import { upgradeV0ToV1 } from './v0-to-v1'

type Json = Record<string, unknown>

/**
 * One small function per version step: `steps[n]` turns a version-n document into version n+1. Add the next
 * step here and bump CHIP_DOCUMENT_VERSION; never edit a published step.
 */
export const upgradeSteps: readonly ((doc: Json) => Json)[] = [upgradeV0ToV1]

export type UpgradeResult = { ok: true; document: Json; from: number } | { ok: false; message: string }

/** Runs every upgrade step from the document's version to `target`. A missing version means version 0. */
export function upgradeChipDocument(input: unknown, target: number): UpgradeResult {
  if (input === null || typeof input !== 'object' || Array.isArray(input)) {
    return {
      ok: false,
      message: 'A chip document must be a JSON object (got ' + (Array.isArray(input) ? 'a list' : String(input)) + ')',
    }
  }
  let doc = input as Json
  const from = doc.version === undefined ? 0 : doc.version
  if (typeof from !== 'number' || !Number.isInteger(from) || from < 0) {
    return { ok: false, message: `Document version must be a whole number 0…${target} (got ${JSON.stringify(from)})` }
  }
  if (from > target) {
    return {
      ok: false,
      message: `Document version ${from} is newer than this Dropwright understands (${target}): update Dropwright`,
    }
  }
  for (let v = from; v < target; v++) {
    const step = upgradeSteps[v]
    if (!step) return { ok: false, message: `No upgrade step from version ${v} to ${v + 1}` }
    doc = step(doc)
  }
  return { ok: true, document: doc, from }
}
