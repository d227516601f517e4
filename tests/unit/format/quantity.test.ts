import { describe, expect, it } from 'vitest'
import {
  formatDocumentValue,
  formatFlowUlMin,
  formatLengthUm,
  formatNumber,
  formatPercent,
  formatPressureMbar,
  formatRateHz,
  formatSi,
  formatVolumePl,
} from '#shared/format/quantity'
import { formatDate, localeFromHeader } from '#shared/format/date'

const NN = '\u202F'

// Each row: what goes in, what a person reads, and the convention it follows.
// SI = BIPM, The International System of Units (SI Brochure), 9th ed., 2019.
describe('quantities as the trade writes them', () => {
  const table: Array<[string, () => string, string]> = [
    ['SI §5.4.3 space between number and unit', () => formatLengthUm(110), '110 µm'],
    [
      'SI Table 7 prefix: 40 500 µm is 40.5 mm (the "Spacing 40500 µm" of issue 16)',
      () => formatLengthUm(40500),
      '40.5 mm',
    ],
    ['no "1.1e+2 µm": 3 figures, no exponent inside 10⁻³…10⁶', () => formatLengthUm(110.4), '110 µm'],
    [
      '2 figures for an estimate outside validity (common practice, no source)',
      () => formatLengthUm(104.6, 'indicative'),
      '100 µm',
    ],
    ['rounding before the prefix: 999.7 µm at 3 figures', () => formatLengthUm(999.7), '1 mm'],
    ['sub-micrometre lengths in nm', () => formatLengthUm(0.25), '250 nm'],
    ['zero keeps the base unit', () => formatLengthUm(0), '0 µm'],
    ['volume prefixes: 33 500 pL is 33.5 nL', () => formatVolumePl(33500), '33.5 nL'],
    ['volume in pL below 1 nL', () => formatVolumePl(33.51), '33.5 pL'],
    ['rate in kHz from 1000 Hz', () => formatRateHz(1350), '1.35 kHz'],
    ['the same rate reads the same everywhere (135 Hz, not 140 Hz)', () => formatRateHz(135.4), '135 Hz'],
    ['pressure stays in mbar, four digits not split (SI §5.4.4)', () => formatPressureMbar(2500), '2500 mbar'],
    ['five digits grouped in threes with a thin space (SI §5.4.4)', () => formatPressureMbar(12500), `12${NN}500 mbar`],
    ['flow in µL/min', () => formatFlowUlMin(2), '2 µL/min'],
    ['percent with a space (SI §5.4.7)', () => formatPercent(0.123), '12.3 %'],
    ['powers of ten as × 10ⁿ (SI §5.4.6)', () => formatNumber(4.2e-5, 2), '4.2 × 10⁻⁵'],
    ['a bare power of ten', () => formatNumber(1e7, 2), '10⁷'],
    ['small dimensionless numbers stay plain from 10⁻³', () => formatNumber(0.00421, 3), '0.00421'],
    ['a true minus sign (SI §5.4.3 typography)', () => formatNumber(-3, 3), '−3'],
    ['no binary noise', () => formatNumber(0.1 + 0.2, 6), '0.3'],
    ['SI input: metres to µm', () => formatSi(40e-6, 'm'), '40 µm'],
    ['SI input: m³ to pL', () => formatSi(3.35e-14, 'm^3'), '33.5 pL'],
    ['SI input: Pa to mbar', () => formatSi(12345, 'Pa'), '123 mbar'],
    ['SI input: m³/s to µL/min', () => formatSi(1e-9 / 60, 'm^3/s'), '1 µL/min'],
    ['SI input: Pa·s to mPa·s', () => formatSi(0.00089, 'Pa*s'), '0.89 mPa·s'],
    ['document value as entered (6 figures)', () => formatDocumentValue(2.125, 'uL/min'), '2.125 µL/min'],
    ['document length, prefixed', () => formatDocumentValue(40500, 'um'), '40.5 mm'],
  ]
  it.each(table)('%s', (_convention, format, expected) => {
    expect(format()).toBe(expected)
  })
})

describe("dates in the viewer's locale, one style per context (ECMA-402 Intl.DateTimeFormat)", () => {
  const at = '2026-12-02T17:45:00Z'
  it('a moment has date and time, in the given zone', () => {
    expect(formatDate(at, 'moment', { locale: 'en-GB', timeZone: 'Europe/London' })).toBe('2 Dec 2026, 17:45')
    expect(formatDate(at, 'moment', { locale: 'en-US', timeZone: 'America/New_York' })).toBe('Dec 2, 2026, 12:45 PM')
  })
  it("before the browser's zone is known, UTC says so", () => {
    expect(formatDate(at, 'moment', { locale: 'en-GB', timeZone: 'UTC' })).toBe('2 Dec 2026, 17:45 UTC')
  })
  it('a day has no time', () => {
    expect(formatDate(at, 'day', { locale: 'de-DE', timeZone: 'UTC' })).toBe('02.12.2026')
  })
  it('missing or unreadable dates read "—"', () => {
    expect(formatDate(null, 'day')).toBe('—')
    expect(formatDate('not a date', 'moment')).toBe('—')
  })
  it('the locale of an Accept-Language header', () => {
    expect(localeFromHeader('de-CH,de;q=0.9,en;q=0.8')).toBe('de-CH')
    expect(localeFromHeader('*')).toBeUndefined()
    expect(localeFromHeader('!!')).toBeUndefined()
    expect(localeFromHeader(undefined)).toBeUndefined()
  })
})
