import type { ChipDocument, LiquidRef } from '#shared/schemas/chip'
import type { FabricationProcess, Finding } from './types'
import { findingId } from './types'

type LiquidClass = 'aqueous' | 'fluorinated-oil' | 'silicone-oil' | 'hydrocarbon-oil' | 'unknown'

/** Classifies a liquid by its library id or name (generic chemical names). */
export function classifyLiquid(l: LiquidRef): LiquidClass {
  const name = ('liquid' in l ? l.liquid : (l.name ?? '')).toLowerCase()
  if (/water|glycerol|aqueous|buffer|pbs|medium/.test(name)) return 'aqueous'
  if (/fluor|hfe|perfluoro/.test(name)) return 'fluorinated-oil'
  if (/silicone|pdms|siloxane/.test(name)) return 'silicone-oil'
  if (/hexadecane|decane|octane|hexane|mineral|paraffin|alkane|oil/.test(name)) return 'hydrocarbon-oil'
  return 'unknown'
}

const PRESSURE_TO_MBAR = { mbar: 1, kPa: 10, psi: 68.9476 } as const // 1 kPa = 10 mbar; 1 psi = 6.894 76 kPa (NIST SP 811)
const SWELL = 'Lee, Park & Whitesides 2003, Anal. Chem. 75, 6544 (solvent compatibility of PDMS)'

/** Wetting, solvent-compatibility and bond-pressure notes from each operating point's liquids and settings. */
export function liquidFindings(doc: ChipDocument, p: FabricationProcess): Finding[] {
  const out: Finding[] = []
  const at = doc.ports[0]?.position ?? { x: 0, y: 0 }
  for (const op of doc.operatingPoints) {
    const add = (rule: string, severity: Finding['severity'], message: string, elements = [op.id], location = at) =>
      out.push({ id: findingId(rule, elements), rule, severity, message, elements, location: { ...location } })
    const cont = classifyLiquid(op.continuousLiquid)
    const disp = classifyLiquid(op.dispersedLiquid)
    if (cont === 'aqueous' && disp !== 'aqueous' && p.material === 'PDMS') {
      add(
        'wetting',
        'warning',
        `Operating point "${op.id}" makes oil-in-water drops, which need walls wetted by water; native PDMS is hydrophobic: make the channels hydrophilic (e.g. a surface treatment) or swap the phases`,
      )
    } else if (cont !== 'aqueous' && disp === 'aqueous' && p.material === 'glass') {
      add(
        'wetting',
        'warning',
        `Operating point "${op.id}" makes water-in-oil drops, which need walls wetted by oil; glass is hydrophilic: apply a hydrophobic treatment`,
      )
    } else if (cont !== 'aqueous' && disp === 'aqueous') {
      add(
        'wetting',
        'info',
        `Operating point "${op.id}": water-in-oil drops need hydrophobic walls; plasma-bonded PDMS is hydrophilic for a while after bonding: let it recover or apply a hydrophobic treatment before use`,
      )
    }
    if (p.material === 'PDMS') {
      for (const [phase, cls] of [
        ['continuous', cont],
        ['dispersed', disp],
      ] as const) {
        if (cls === 'hydrocarbon-oil' || cls === 'silicone-oil') {
          add(
            `solvent-${phase}`,
            'warning',
            `Operating point "${op.id}": the ${phase} phase (${cls.replace('-', ' ')}) swells PDMS (${SWELL}); expect channel sizes to change over hours: prefer a fluorinated oil or a glass chip`,
          )
        } else if (cls === 'unknown') {
          add(
            `solvent-${phase}`,
            'info',
            `Operating point "${op.id}": the ${phase} liquid is not classified, so PDMS compatibility was not checked (${SWELL}): name it or choose it from the library`,
          )
        }
      }
    }
    for (const s of op.inlets) {
      if (s.mode !== 'pressure') continue
      const mbar = s.value * PRESSURE_TO_MBAR[s.unit]
      if (mbar > p.bondPressureLimitMbar) {
        const port = doc.ports.find(x => x.id === s.portId)
        add(
          'bond-pressure',
          'error',
          `Operating point "${op.id}" drives port "${s.portId}" at ${mbar.toFixed(0)} mbar, above the ${p.bondPressureLimitMbar} mbar bond limit of this process: lower the pressure (bonded chips can burst and spray)`,
          [op.id, s.portId],
          port?.position ?? at,
        )
      }
    }
  }
  return out
}
