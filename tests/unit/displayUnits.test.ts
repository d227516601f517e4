import { describe, expect, it } from 'vitest'
import { displayUnit } from '../../shared/utils/displayUnits'

describe('units on screen', () => {
  it('writes micro as µ and degrees Celsius as °C', () => {
    expect(displayUnit('uL/min')).toBe('µL/min')
    expect(displayUnit('uL/h')).toBe('µL/h')
    expect(displayUnit('um')).toBe('µm')
    expect(displayUnit('degC')).toBe('°C')
  })
  it('leaves other units alone', () => {
    expect(displayUnit('mbar')).toBe('mbar')
    expect(displayUnit('mL/h')).toBe('mL/h')
  })
})
