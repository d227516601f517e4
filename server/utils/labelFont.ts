// The font the mask DXF outlines its text with: IBM Plex Sans Medium (latin), the woff shipped in
// @fontsource/ibm-plex-sans, parsed once per process (or worker thread) by fontkit (reads TTF, OTF, WOFF, WOFF2).
// geometry/ stays pure: it gets the parsed font through the OutlineFont interface.
import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { join } from 'node:path'
import { create, type FontkitFont } from 'fontkit'
import type { GlyphCommand, OutlineFont } from '../../geometry/dxf'

const FILE = '@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-500-normal.woff'

function fontBytes(): Buffer {
  try {
    return readFileSync(createRequire(join(process.cwd(), 'package.json')).resolve(FILE))
  } catch {
    return readFileSync(createRequire(import.meta.url).resolve(FILE))
  }
}

function asOutlineFont(f: FontkitFont): OutlineFont {
  return {
    unitsPerEm: f.unitsPerEm,
    capHeight: f.capHeight,
    hasCharacter: (cp) => f.hasGlyphForCodePoint(cp),
    layout: (text) => {
      const run = f.layout(text)
      return run.glyphs.map((g, i) => ({
        id: g.id,
        commands: g.path.commands as GlyphCommand[],
        xAdvance: run.positions[i]?.xAdvance ?? 0,
        xOffset: run.positions[i]?.xOffset ?? 0,
        yOffset: run.positions[i]?.yOffset ?? 0,
      }))
    },
  }
}

let cached: OutlineFont | undefined

/** The label font, parsed on first use and kept for the life of the process. */
export function labelFont(): OutlineFont {
  cached ??= asOutlineFont(create(fontBytes()))
  return cached
}
