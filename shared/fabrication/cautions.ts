// The usual cautions that travel with a fab sheet (printable page and PDF): one list, so both say the same.
export const FAB_SHEET_CAUTIONS = [
  'Bonded chips have a pressure limit; pressurised chips and tubing can burst and spray. Ramp pressure slowly and wear eye protection.',
  'Organic solvents and some oils swell PDMS and change channel sizes; check compatibility before use.',
  'Photolithography and surface treatments use hazardous chemicals (photoresists, developers, silanes, plasma). Use them only with training, in a fume hood, with the right protective equipment.',
  'Biological samples follow their biosafety level.',
  "Forecasts are estimates. Follow your lab's safety office, local codes and the fabrication partner's own rules; they take precedence over this sheet.",
] as const

/**
 * Smallest feature a mask can carry reliably. Common practice, no source: printed film masks resolve about
 * 10 µm lines, chrome-on-glass masks about 1 µm.
 */
export const MASK_RESOLUTION_UM = { film: 10, chrome: 1 } as const

/** A round scale-bar length (1, 2 or 5 × 10ⁿ µm) near a fifth of the drawn width. */
export function scaleBarUm(widthUm: number): number {
  const target = widthUm / 5
  const decade = 10 ** Math.floor(Math.log10(target))
  return [5, 2, 1].map(f => f * decade).find(v => v <= target) ?? decade
}

export const lengthLabel = (um: number) => (um >= 1000 ? `${um / 1000} mm` : `${um} µm`)
