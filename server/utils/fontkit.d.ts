// fontkit ships no types; the part labelFont.ts (beside it) uses.
declare module 'fontkit' {
  export interface FontkitGlyph {
    id: number
    advanceWidth: number
    path: { commands: { command: string; args: number[] }[] }
  }
  export interface FontkitFont {
    unitsPerEm: number
    capHeight: number
    hasGlyphForCodePoint(codePoint: number): boolean
    glyphForCodePoint(codePoint: number): FontkitGlyph
  }
  export function create(buffer: Uint8Array): FontkitFont
}
