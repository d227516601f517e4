// One way to write a quantity on screen, everywhere: significant figures by how sure the method is, an SI prefix
// chosen so the number stays between 1 and 999 (40.5 mm, not "40500 µm"), a space between number and unit.
//
// Conventions followed (BIPM, The International System of Units, SI Brochure, 9th ed., 2019):
//  - §5.4.3: the numerical value always precedes the unit, with a space between them ("110 µm"); the same holds for
//    "%" (§5.4.7). The degree of plane angle "°" is the exception: no space.
//  - §5.4.4: digits may be grouped in threes with a thin space, never a dot or comma; a group of four digits is
//    not split ("2500 mbar", "40 500"). Here a narrow no-break space (U+202F) so a number never wraps.
//  - §3 (Table 7, SI prefixes): one prefix per unit, chosen so the number reads without powers of ten.
//  - §5.4.6: a power of ten is written "× 10ⁿ" (never "e+2").
//  Pressure stays in mbar, flow in µL/min and viscosity in mPa·s however large: they are the trade's units
//  (PRODUCT.md, conventions of the trade), not SI prefixes of a base unit.
// Pure: no Vue, no I/O; the same string on the server, in the editor and on the revision page.

/**
 * How sure the number is:
 *  - `input`: typed by a person or stored in the document: shown as entered (up to 6 significant figures);
 *  - `estimate`: a forecast inside its method's validity: 3 significant figures;
 *  - `indicative`: a forecast outside its method's validity: 2 significant figures (and a ⚠ beside it).
 * Common practice, no source: the scaling laws behind the forecast are good to some 10 % inside their range
 * (so 3 figures never overstate them), and to a factor of order 1.5–2 outside it (2 figures).
 */
export type Confidence = 'input' | 'estimate' | 'indicative'

export const SIGNIFICANT_FIGURES: Record<Confidence, number> = { input: 6, estimate: 3, indicative: 2 }

/** `valid` of a forecast quantity → its confidence. */
export const confidenceOf = (valid: boolean): Confidence => (valid ? 'estimate' : 'indicative')

const NNBSP = '\u202F'
const MINUS = '\u2212'
const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
}

/** Groups the integer part in threes when it has five digits or more (SI Brochure 9th ed. §5.4.4). */
function group(digits: string): string {
  const [int, frac] = digits.split('.') as [string, string | undefined]
  const grouped = int.length > 4 ? int.replace(/\B(?=(\d{3})+(?!\d))/g, NNBSP) : int
  return frac === undefined ? grouped : `${grouped}.${frac}`
}

/** Rounds to `figures` significant figures; exact decimal text (no binary noise like 0.30000000000000004). */
function rounded(v: number, figures: number): string {
  const text = Number(v.toPrecision(figures)).toString()
  if (!/e/.test(text)) return text
  // toString switches to exponent form for |v| ≥ 1e21 or < 1e-6; write the digits out (the caller avoids that range).
  return Number(text).toFixed(Math.max(0, -Math.floor(Math.log10(Math.abs(v))) + figures - 1))
}

/**
 * A plain number with `figures` significant figures: grouped digits inside 10⁻³ ≤ |v| < 10⁶, "× 10ⁿ" outside
 * (SI Brochure 9th ed. §5.4.6). Trailing zeros are dropped ("0.5", not "0.500"): an estimate's figures are a
 * ceiling, not a claim.
 */
export function formatNumber(v: number, figures = 3): string {
  if (!Number.isFinite(v)) return '—'
  if (v === 0) return '0'
  const sign = v < 0 ? MINUS : ''
  const a = Math.abs(v)
  if (a >= 1e-3 && a < 1e6) return sign + group(rounded(a, figures))
  const [mantissa, exponent] = a.toExponential(figures - 1).split('e') as [string, string]
  const m = Number(mantissa).toString()
  const power = String(Number(exponent)).replace(/./g, c => SUPERSCRIPT[c] ?? c)
  return `${sign}${m === '1' ? '' : `${m} × `}10${power}`
}

interface Step {
  factor: number
  unit: string
}

/** Picks the first step whose number is ≥ 1 (steps ordered from the largest unit down); the smallest otherwise. */
function withPrefix(value: number, steps: Step[], figures: number): string {
  if (!Number.isFinite(value)) return '—'
  const a = Math.abs(value)
  let step = steps[steps.length - 1]!
  for (const s of steps) {
    // Round first, so 999.7 µm at 3 figures reads "1 mm", not "1000 µm".
    if (a !== 0 && Number((a / s.factor).toPrecision(figures)) >= 1) {
      step = s
      break
    }
  }
  if (a === 0) step = steps.find(s => s.factor === 1) ?? step
  return `${formatNumber(value / step.factor, figures)} ${step.unit}`
}

const LENGTH_UM: Step[] = [
  { factor: 1e3, unit: 'mm' },
  { factor: 1, unit: 'µm' },
  { factor: 1e-3, unit: 'nm' },
]
const VOLUME_PL: Step[] = [
  { factor: 1e6, unit: 'µL' },
  { factor: 1e3, unit: 'nL' },
  { factor: 1, unit: 'pL' },
  { factor: 1e-3, unit: 'fL' },
]
const RATE_HZ: Step[] = [
  { factor: 1e6, unit: 'MHz' },
  { factor: 1e3, unit: 'kHz' },
  { factor: 1, unit: 'Hz' },
  { factor: 1e-3, unit: 'mHz' },
]

const figuresOf = (c: Confidence | number) => (typeof c === 'number' ? c : SIGNIFICANT_FIGURES[c])

/** A length given in µm: nm below 1 µm, mm from 1000 µm ("40.5 mm"). */
export const formatLengthUm = (um: number, c: Confidence | number = 'estimate') =>
  withPrefix(um, LENGTH_UM, figuresOf(c))
/** A droplet volume given in pL: fL, pL, nL or µL. */
export const formatVolumePl = (pl: number, c: Confidence | number = 'estimate') =>
  withPrefix(pl, VOLUME_PL, figuresOf(c))
/** A generation rate given in Hz: Hz, kHz or MHz. */
export const formatRateHz = (hz: number, c: Confidence | number = 'estimate') => withPrefix(hz, RATE_HZ, figuresOf(c))
/** A pressure given in mbar, always in mbar (the trade's unit for chip pressures). */
export const formatPressureMbar = (mbar: number, c: Confidence | number = 'estimate') =>
  `${formatNumber(mbar, figuresOf(c))} mbar`
/** A flow rate given in µL/min, always in µL/min (the unit pumps are set in). */
export const formatFlowUlMin = (ulMin: number, c: Confidence | number = 'estimate') =>
  `${formatNumber(ulMin, figuresOf(c))} µL/min`
/** A fraction (0.12) as a percentage with a space before "%" (SI Brochure 9th ed. §5.4.7): "12 %". */
export const formatPercent = (fraction: number, c: Confidence | number = 'estimate') =>
  `${formatNumber(fraction * 100, figuresOf(c))} %`
/** A dimensionless number (Ca, Re, a ratio). */
export const formatPlain = (v: number, c: Confidence | number = 'estimate') => formatNumber(v, figuresOf(c))

/** Units as people read them: the document stores ASCII names ("uL/min"), the screen shows "µL/min". */
export function displayUnitName(unit: string): string {
  return unit
    .replace(/^u(?=[LmM])/, 'µ')
    .replace(/\bu(?=m\b)/, 'µ')
    .replace('degC', '°C')
    .replace('Pa*s', 'Pa·s')
    .replace('^3', '³')
    .replace('^2', '²')
}

/**
 * A quantity in SI (as the physics core returns it: `m`, `m^3`, `Hz`, `Pa`, `m^3/s`, `Pa*s`, `N/m`, `1`) written
 * in the trade's units with the prefix rules above.
 */
export function formatSi(value: number, unit: string, c: Confidence | number = 'estimate'): string {
  switch (unit) {
    case 'm':
      return formatLengthUm(value * 1e6, c)
    case 'm^3':
      return formatVolumePl(value * 1e15, c)
    case 'Hz':
      return formatRateHz(value, c)
    case 'Pa':
      return formatPressureMbar(value / 100, c)
    case 'm^3/s':
      return formatFlowUlMin(value * 6e10, c)
    case 'Pa*s':
      return `${formatNumber(value * 1e3, figuresOf(c))} mPa·s`
    case 'N/m':
      return `${formatNumber(value * 1e3, figuresOf(c))} mN/m`
    case 'm/s':
      return value !== 0 && Math.abs(value) < 1e-3
        ? `${formatNumber(value * 1e6, figuresOf(c))} µm/s`
        : `${formatNumber(value * 1e3, figuresOf(c))} mm/s`
    case 's':
      return value !== 0 && Math.abs(value) < 1
        ? `${formatNumber(value * 1e3, figuresOf(c))} ms`
        : `${formatNumber(value, figuresOf(c))} s`
    case 'K':
      return `${formatNumber(value - 273.15, figuresOf(c))} °C`
    case '1':
    case '':
      return formatNumber(value, figuresOf(c))
    default:
      return `${formatNumber(value, figuresOf(c))} ${displayUnitName(unit)}`
  }
}

/** A value typed in the document's own unit ("uL/min", "mbar", "um"), as entered: "2 µL/min", "40.5 mm". */
export function formatDocumentValue(value: number, unit: string): string {
  if (unit === 'um' || unit === 'µm') return formatLengthUm(value, 'input')
  return `${formatNumber(value, SIGNIFICANT_FIGURES.input)} ${displayUnitName(unit)}`
}
