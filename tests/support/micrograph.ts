// Synthetic micrographs as PNG bytes for tests (drawn by shared/imaging/synthetic.ts, encoded with sharp).
import sharp from 'sharp'
import { renderMicrograph, scatterDrops, type SyntheticOptions } from '../../shared/imaging/synthetic'

export async function micrographPng(
  options: Omit<SyntheticOptions, 'drops'> & { drops: SyntheticOptions['drops'] },
): Promise<Uint8Array> {
  const image = renderMicrograph(options)
  return sharp(Buffer.from(image.data), { raw: { width: image.width, height: image.height, channels: 1 } })
    .png()
    .toBuffer()
}

export async function dropsPng(count: number, diameterPx: number, size = 512, seed = 3) {
  const { separated } = scatterDrops({ width: size, height: size, count, meanDiameter: diameterPx, cv: 0.04, seed })
  return { png: await micrographPng({ width: size, height: size, drops: separated, seed }), drops: separated }
}
