// The lines both fab sheets print (the printable page and the PDF), so they say the same thing in the same words,
// every number through shared/format. Pure: no Vue, no I/O.
import { processValuesSource } from '../../geometry/rules/processes'
import type { FabricationProcess } from '../../geometry/rules/types'
import { formatDocumentValue, formatLengthUm, formatPressureMbar } from '../format/quantity'
import type { LibrarySnapshot } from '../types/designs'

/** A length stored in the document (µm), as entered: "50 µm", "10 mm". */
export const storedLength = (um: number): string => formatLengthUm(um, 'input')

/** "Film-mask soft lithography …: minimum feature 20 µm, minimum gap 20 µm, depths 5 µm to 250 µm, bond limit 2000 mbar". */
export function processLine(p: FabricationProcess): string {
  return `${p.name}: minimum feature ${storedLength(p.minFeature)}, minimum gap ${storedLength(p.minGap)}, depths ${storedLength(p.minDepth)} to ${storedLength(p.maxDepth)}, bond limit ${formatPressureMbar(p.bondPressureLimitMbar, 'input')}`
}

/** Where the printed process values come from ("common practice, no source", or the lab's own source). */
export const processSourceLine = (p: FabricationProcess): string => `values: ${processValuesSource(p)}`

/** One inlet setting of an operating point: "oil-in: flow rate 10 µL/min", "water-in: pressure 250 mbar". */
export function inletLine(i: { portId: string; mode: string; value: number; unit: string }): string {
  return `${i.portId}: ${i.mode === 'pressure' ? 'pressure' : 'flow rate'} ${formatDocumentValue(i.value, i.unit)}`
}

/** A temperature stored in °C: "22 °C". */
export const temperatureLine = (c: number): string => formatDocumentValue(c, 'degC')

interface PhasesOf {
  id: string
  continuousLiquid: unknown
  dispersedLiquid: unknown
  surfactant?: string | null
  temperatureC: number
}

/**
 * "Continuous phase Test oil, lot 1, dispersed phase water, surfactant our-mix, 22 °C": the liquids of the active
 * operating point by the names stored with the revision (a lab's own liquid by its name, not its "lab-…" id).
 */
export function phasesLine(op: PhasesOf, library?: LibrarySnapshot | null): string {
  const name = (ref: unknown, stored: LibrarySnapshot['continuous'] | undefined) => {
    if (!ref || typeof ref !== 'object' || !('liquid' in ref)) return 'custom properties'
    const id = String((ref as { liquid: string }).liquid)
    return library?.operatingPoint === op.id && stored?.id === id ? stored.name : id
  }
  const surfactant = op.surfactant ? `, surfactant ${op.surfactant}` : ''
  return `Continuous phase ${name(op.continuousLiquid, library?.continuous)}, dispersed phase ${name(op.dispersedLiquid, library?.dispersed)}${surfactant}, ${temperatureLine(op.temperatureC)}`
}

/** Where a finding sits on the chip, to the micrometre: "at x 4.8 mm, y 3 mm". */
export const locationLine = (p: { x: number; y: number }): string =>
  `at x ${storedLength(Math.round(p.x))}, y ${storedLength(Math.round(p.y))}`
