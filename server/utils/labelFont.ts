// The font the mask DXF outlines its text with: IBM Plex Sans Medium (latin), the woff shipped in
// @fontsource/ibm-plex-sans, parsed once per process (or worker thread) by fontkit 2 (reads TTF, OTF, WOFF, WOFF2).
// geometry/ stays pure: it gets the parsed font through the OutlineFont interface.
// eslint-disable-next-line @typescript-eslint/triple-slash-reference -- fontkit ships no types, and every tsconfig that reaches this file (server, app via scripts/tests) must see them
/// <reference path="./fontkit.d.ts" />
import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { join } from 'node:path'
import { create, type FontkitFont } from 'fontkit'
import type { GlyphCommand, OutlineFont, ShapedGlyph } from '../../geometry/dxf'

const FILE = '@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-500-normal.woff'

function fontBytes(): Buffer {
  try {
    return readFileSync(createRequire(join(process.cwd(), 'package.json')).resolve(FILE))
  } catch {
    return readFileSync(createRequire(import.meta.url).resolve(FILE))
  }
}

/**
 * One glyph per character at its advance width, each kept once read. No kerning or ligatures: fontkit's full
 * layout (GSUB/GPOS shaping) cost ~160 ms on a thread's first label and ~8 ms after, for a title block whose
 * letters read the same without it.
 */
function asOutlineFont(f: FontkitFont): OutlineFont {
  const glyphs = new Map<number, ShapedGlyph>()
  const glyph = (cp: number): ShapedGlyph => {
    let g = glyphs.get(cp)
    if (!g) {
      const fg = f.glyphForCodePoint(cp)
      g = { id: fg.id, commands: fg.path.commands as GlyphCommand[], xAdvance: fg.advanceWidth, xOffset: 0, yOffset: 0 }
      glyphs.set(cp, g)
    }
    return g
  }
  for (let cp = 0x20; cp <= 0x7e; cp++) glyph(cp) // printable ASCII read up front, with the font
  return {
    unitsPerEm: f.unitsPerEm,
    capHeight: f.capHeight,
    hasCharacter: cp => f.hasGlyphForCodePoint(cp),
    layout: text => [...text].map(ch => glyph(ch.codePointAt(0)!)),
  }
}

let cached: OutlineFont | undefined

/** The label font, parsed on first use (the geometry worker does so as it starts) and kept for the life of the process. */
export function labelFont(): OutlineFont {
  cached ??= asOutlineFont(create(fontBytes()))
  return cached
}
