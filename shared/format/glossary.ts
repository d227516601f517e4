// One name per symbol, defined once; the screen shows the symbol with this definition on hover (title attribute).
// φ is the dispersed volume fraction Qd/(Qc + Qd) (the usual meaning of φ for an emulsion); the flow-rate ratio
// Qd/Qc is written as "Qd/Qc" and never called φ.

export interface Term {
  symbol: string
  name: string
  definition: string
}

export const GLOSSARY = {
  capillaryNumber: {
    symbol: 'Ca',
    name: 'Capillary number',
    definition:
      'Ca = μ U / γ: viscous stress against interfacial tension (the continuous phase at a T-junction or cross, the dispersed phase in a step nozzle)',
  },
  reynoldsNumber: { symbol: 'Re', name: 'Reynolds number', definition: 'Re = ρ U Dh / μ: inertia against viscosity' },
  weberNumber: {
    symbol: 'We',
    name: 'Weber number',
    definition: 'We = ρ U² w / γ: inertia against interfacial tension',
  },
  bondNumber: {
    symbol: 'Bo',
    name: 'Bond number',
    definition: 'Bo = Δρ g w² / γ: gravity against interfacial tension',
  },
  viscosityRatio: {
    symbol: 'λ',
    name: 'Viscosity ratio',
    definition: 'λ = μd / μc: dispersed over continuous viscosity',
  },
  flowRateRatio: { symbol: 'Qd/Qc', name: 'Flow-rate ratio', definition: 'Qd/Qc: dispersed over continuous flow rate' },
  dispersedFraction: {
    symbol: 'φ',
    name: 'Dispersed fraction',
    definition: 'φ = Qd / (Qc + Qd): volume fraction of dispersed phase in the droplet train',
  },
  laplacePressure: {
    symbol: 'ΔpL',
    name: 'Laplace pressure',
    definition: 'The pressure jump across the curved, confined interface (Young–Laplace)',
  },
  entryPressure: {
    symbol: 'Δp entry',
    name: 'Entry pressure',
    definition: 'The pressure the dispersed phase needs to enter the junction past the narrowest opening',
  },
  dropletDiameter: {
    symbol: 'Ø',
    name: 'Droplet diameter',
    definition: 'Diameter of the sphere of the same volume as the droplet',
  },
  frequency: { symbol: 'f', name: 'Generation rate', definition: 'Droplets made per second at this junction' },
} satisfies Record<string, Term>

export type TermKey = keyof typeof GLOSSARY

/** "Ca — Ca = μ U / γ: …" for a title attribute. */
export const termTitle = (key: TermKey): string =>
  `${GLOSSARY[key].name} (${GLOSSARY[key].symbol}): ${GLOSSARY[key].definition}`
