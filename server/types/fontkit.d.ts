// fontkit ships no types; the part server/utils/labelFont.ts uses.
declare module 'fontkit' {
  export interface FontkitGlyph { id: number, path: { commands: { command: string, args: number[] }[] } }
  export interface FontkitPosition { xAdvance: number, xOffset: number, yOffset: number }
  export interface FontkitFont {
    unitsPerEm: number
    capHeight: number
    hasGlyphForCodePoint(codePoint: number): boolean
    layout(text: string): { glyphs: FontkitGlyph[], positions: FontkitPosition[] }
  }
  export function create(buffer: Uint8Array): FontkitFont
}
