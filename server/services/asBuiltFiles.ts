// Files of an as-built report: profilometer traces (CSV) and photos. The type is decided on the bytes: file-type
// for images; a CSV has no signature, so it must be UTF-8 text that parses as rows with at least one number column.
import { randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import { fileTypeFromBuffer } from 'file-type'
import { createError } from 'h3'
import Papa from 'papaparse'
import { asBuiltFiles, asBuilts } from '../db/schema'
import { useDb } from '../utils/db'
import type { LabCaller } from '../utils/access'
import { notFound } from './designGuards'
import { getObject, objectKey, putObject } from './storage'
import { assertMayRecord } from './asBuilt'

export const AS_BUILT_IMAGE_TYPES = ['image/png', 'image/jpeg', 'image/tiff'] as const
const refused = (message: string) => createError({ statusCode: 415, statusMessage: 'Unsupported Media Type', message })

/** 'text/csv' for a profilometer export, an image type for a photo; anything else is refused whatever its name says. */
export async function sniffAsBuiltFile(bytes: Uint8Array, fileName: string): Promise<string> {
  const found = await fileTypeFromBuffer(bytes)
  if (found && (AS_BUILT_IMAGE_TYPES as readonly string[]).includes(found.mime)) return found.mime
  if (found)
    throw refused(
      `"${fileName}" is a ${found.ext.toUpperCase()} file (${found.mime}): attach a profilometer CSV or a PNG, JPEG or TIFF photo`,
    )
  let text: string
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes)
  } catch {
    throw refused(
      `"${fileName}" is neither text nor an image we can read: attach a profilometer CSV or a PNG, JPEG or TIFF photo`,
    )
  }
  const parsed = Papa.parse<string[]>(text.slice(0, 200_000), { skipEmptyLines: true })
  const rows = parsed.data.filter(r => Array.isArray(r))
  const numeric = rows.filter(r => r.some(cell => cell.trim() !== '' && Number.isFinite(Number(cell))))
  if (text.includes('\u0000') || rows.length < 2 || numeric.length < 1)
    throw refused(
      `"${fileName}" does not read as a CSV of measurements (rows of numbers): export the profilometer trace as CSV`,
    )
  return 'text/csv'
}

export async function attachAsBuiltFile(
  caller: LabCaller,
  revisionId: string,
  asBuiltId: string,
  file: { bytes: Uint8Array; fileName: string },
) {
  assertMayRecord(caller)
  const db = useDb()
  const [report] = await db
    .select({ id: asBuilts.id })
    .from(asBuilts)
    .where(and(eq(asBuilts.id, asBuiltId), eq(asBuilts.revisionId, revisionId), eq(asBuilts.labId, caller.lab.labId)))
  if (!report) throw notFound('as-built report')
  const contentType = await sniffAsBuiltFile(file.bytes, file.fileName)
  const id = randomUUID()
  const safeName = file.fileName.replace(/[^\w.-]+/g, '_').slice(-120) || 'file'
  const key = objectKey(caller.lab.labId, 'as-built', asBuiltId, `${id}-${safeName}`)
  await putObject(key, file.bytes, contentType)
  await db.insert(asBuiltFiles).values({
    id,
    labId: caller.lab.labId,
    asBuiltId,
    objectKey: key,
    contentType,
    bytes: file.bytes.byteLength,
    fileName: file.fileName.slice(0, 200),
    createdBy: caller.userId,
  })
  return { fileId: id, contentType, bytes: file.bytes.byteLength, fileName: file.fileName }
}

export async function readAsBuiltFile(caller: LabCaller, revisionId: string, asBuiltId: string, fileId: string) {
  const [row] = await useDb()
    .select({ key: asBuiltFiles.objectKey, contentType: asBuiltFiles.contentType, fileName: asBuiltFiles.fileName })
    .from(asBuiltFiles)
    .innerJoin(asBuilts, eq(asBuilts.id, asBuiltFiles.asBuiltId))
    .where(
      and(
        eq(asBuiltFiles.id, fileId),
        eq(asBuiltFiles.asBuiltId, asBuiltId),
        eq(asBuilts.revisionId, revisionId),
        eq(asBuiltFiles.labId, caller.lab.labId),
      ),
    )
  if (!row) throw notFound('file')
  return { ...row, bytes: await getObject(row.key) }
}
