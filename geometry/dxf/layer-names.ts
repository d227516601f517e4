// DXF layer names of a Dropwright mask: one per channel depth, plus outline, marks and text.
export const OUTLINE_LAYER = 'OUTLINE'
export const MARKS_LAYER_NAME = 'MARKS'
export const TEXT_LAYER = 'TEXT'

/** `CH-50um`, `CH-12.5um`: the depth is in the name so the fab partner sees it without the mail. */
export function depthLayerName(depthUm: number): string {
  const rounded = Math.round(depthUm * 1000) / 1000
  return `CH-${rounded}um`
}

/** DXF text is written as plain ASCII so every reader shows it the same way. */
export function asciiText(s: string): string {
  return s
    .replace(/µ/g, 'u')
    .normalize('NFKD')
    .replace(/[^\x20-\x7e]/g, '')
    .trim()
}
