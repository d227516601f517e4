// The work a micrograph's bytes need, done in the imaging process (server/workers/imaging.ts) and never on the
// request thread: parsing the upload's form, checking the file by its bytes, storing the original, its browser view
// and its thumbnail, and later measuring the stored original. The request thread only hands the body over and
// writes rows, so a 20 MB upload costs it no parsing, hashing or copying: the body reaches this process as a file
// streamed from the request (copying it through the process pipe took the request thread 30–60 ms per 20 MB).
import { readFile } from 'node:fs/promises'
import { measureDrops, type Measurement } from '#shared/imaging/measure'
import { MAX_MICROGRAPH_PIXELS, micrographScale } from '#shared/schemas/bench'
import sharp from 'sharp'
import { micrographForm, parseMultipart } from '../utils/multipart'
import { parseOr400 } from '../utils/validate'
import { decodeGrey, sniffMicrograph, thumbnail, webImage } from './benchImages'
import { getObject, objectKey, putObject } from './storage'

export interface StoreMicrographTask {
  labId: string
  micrographId: string
  /** A file holding the whole multipart/form-data body (the request thread wrote it), and its Content-Type. */
  bodyFile: string
  contentType: string
}

export interface StoredMicrograph {
  umPerPx: number
  fileName: string
  contentType: string
  bytes: number
  width: number
  height: number
  objectKey: string
  thumbnailKey: string
}

/** Parses the form, checks the scale (400) and the file's bytes (415, 413), then stores the three objects. */
export async function storeMicrographUpload(task: StoreMicrographTask): Promise<StoredMicrograph> {
  const body = await readFile(task.bodyFile)
  const form = micrographForm(body.length ? await parseMultipart(body, task.contentType) : [])
  const { umPerPx } = parseOr400(micrographScale, form.fields, 'Scale')
  const { bytes, fileName } = form.file
  const contentType = await sniffMicrograph(bytes, fileName)
  const meta = await sharp(bytes, { limitInputPixels: MAX_MICROGRAPH_PIXELS })
    .metadata()
    .catch(() => null)
  if (!meta?.width || !meta.height) await decodeGrey(bytes) // throws the message naming the problem
  const key = (name: string) => objectKey(task.labId, 'micrographs', task.micrographId, name)
  const stored: StoredMicrograph = {
    umPerPx,
    fileName: fileName.slice(0, 200),
    contentType,
    bytes: bytes.byteLength,
    width: meta?.width ?? 0,
    height: meta?.height ?? 0,
    objectKey: key('original'),
    thumbnailKey: key('thumbnail.jpg'),
  }
  await putObject(stored.objectKey, bytes, contentType)
  await putObject(stored.thumbnailKey, await thumbnail(bytes), 'image/jpeg')
  const tiff = contentType === 'image/tiff'
  await putObject(key('view.png'), tiff ? await webImage(bytes) : bytes, tiff ? 'image/png' : contentType)
  return stored
}

export interface MeasureMicrographTask {
  objectKey: string
  umPerPx: number
}

/** Fetches the stored original, decodes it to grey and finds the drops. */
export async function measureStoredMicrograph(
  task: MeasureMicrographTask,
): Promise<{ width: number; height: number; measurement: Measurement }> {
  const image = await decodeGrey(await getObject(task.objectKey))
  const measurement = measureDrops(
    { width: image.width, height: image.height, data: image.pixels },
    { umPerPx: task.umPerPx },
  )
  return { width: image.width, height: image.height, measurement }
}
