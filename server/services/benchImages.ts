// Micrograph files: the type checked on the bytes (file-type), decoded and thumbnailed with sharp. Called in the
// imaging process (server/services/micrographWork.ts), so a large image never holds the request thread up.
import { fileTypeFromBuffer } from 'file-type'
import { createError } from 'h3'
import sharp from 'sharp'
import { MAX_MICROGRAPH_PIXELS, MICROGRAPH_TYPES } from '#shared/schemas/bench'

// One libvips thread per image operation: decoding, thumbnailing and re-encoding a 20 MB micrograph would
// otherwise take every core of the machine at once, and the requests answered beside it wait.
sharp.concurrency(1)

const badImage = (message: string) => createError({ statusCode: 415, statusMessage: 'Unsupported Media Type', message })

/** The image type read from the bytes; anything but PNG, JPEG or TIFF is refused whatever its name says. */
export async function sniffMicrograph(bytes: Uint8Array, fileName: string): Promise<(typeof MICROGRAPH_TYPES)[number]> {
  const found = await fileTypeFromBuffer(bytes)
  if (found && (MICROGRAPH_TYPES as readonly string[]).includes(found.mime))
    return found.mime as (typeof MICROGRAPH_TYPES)[number]
  const what = found ? `a ${found.ext.toUpperCase()} file (${found.mime})` : 'not an image we can read'
  throw badImage(`"${fileName}" is ${what}, whatever its name says: upload a PNG, JPEG or TIFF micrograph`)
}

export interface DecodedImage {
  width: number
  height: number
  pixels: Uint8Array
}

/** Grey 8-bit pixels of the image (first page of a TIFF); refuses images above the pixel limit before decoding. */
export async function decodeGrey(bytes: Uint8Array): Promise<DecodedImage> {
  try {
    const image = sharp(bytes, { limitInputPixels: MAX_MICROGRAPH_PIXELS, failOn: 'error' })
    const { data, info } = await image.greyscale().toColourspace('b-w').raw().toBuffer({ resolveWithObject: true })
    if (info.channels !== 1) throw new Error(`expected one channel, got ${info.channels}`)
    return {
      width: info.width,
      height: info.height,
      pixels: new Uint8Array(data.buffer, data.byteOffset, data.byteLength),
    }
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error)
    if (/pixel limit/i.test(message))
      throw createError({
        statusCode: 413,
        statusMessage: 'Payload Too Large',
        message: `The image has more than ${MAX_MICROGRAPH_PIXELS / 1024 / 1024} megapixels; crop or scale it down`,
      })
    throw badImage(`The image could not be decoded (${message.slice(0, 120)}): save it again as PNG, JPEG or TIFF`)
  }
}

/** A 320-px-wide JPEG preview. */
export async function thumbnail(bytes: Uint8Array): Promise<Uint8Array> {
  return sharp(bytes, { limitInputPixels: MAX_MICROGRAPH_PIXELS })
    .resize({ width: 320, withoutEnlargement: true })
    .jpeg({ quality: 80 })
    .toBuffer()
}

/** The image as PNG for the overlay view (browsers do not show TIFF). */
export async function webImage(bytes: Uint8Array): Promise<Uint8Array> {
  return sharp(bytes, { limitInputPixels: MAX_MICROGRAPH_PIXELS }).png({ compressionLevel: 3 }).toBuffer()
}
