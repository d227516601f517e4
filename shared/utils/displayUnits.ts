// Units as people read them: the document stores ASCII unit names ("uL/min"), the screen shows "µL/min".
export function displayUnit(unit: string): string {
  return unit
    .replace(/^u(?=[LmM])/, 'µ')
    .replace(/\bu(?=m\b)/, 'µ')
    .replace('degC', '°C')
}
