// Liquid water at about 0.1 MPa: surface tension, viscosity and density against temperature.
import type { Method } from '../quantity'
import type { Kelvin, KilogramsPerCubicMetre, NewtonsPerMetre, PascalSeconds } from '../units'

/** Critical temperature of water, IAPWS R1-76(2014). */
const CRITICAL_TEMPERATURE = 647.096

export const IAPWS_SURFACE_TENSION: Method = {
  id: 'iapws-r1-76-2014-surface-tension',
  source:
    'IAPWS R1-76(2014), Revised Release on Surface Tension of Ordinary Water Substance: σ = B τ^μ (1 + b τ), τ = 1 − T/Tc',
}

/**
 * σ(T) = B τ^μ (1 + b τ), B = 235.8 mN/m, b = −0.625, μ = 1.256, τ = 1 − T/647.096 K (IAPWS R1-76(2014), eq. 1).
 * Valid from the triple point (273.16 K) to the critical point; the release says it also extrapolates
 * acceptably into the supercooled liquid down to −25 °C.
 */
export function waterSurfaceTension(temperature: Kelvin): NewtonsPerMetre {
  const tau = 1 - temperature / CRITICAL_TEMPERATURE
  return (235.8e-3 * tau ** 1.256 * (1 - 0.625 * tau)) as NewtonsPerMetre
}
export const waterSurfaceTensionRange = { min: 248.15, max: CRITICAL_TEMPERATURE } as const

export const KELL_DENSITY: Method = {
  id: 'kell-1975-water-density',
  source: 'Kell G.S. (1975) J. Chem. Eng. Data 20, 97–105, eq. 16 (air-free water at 1 atm, 0–150 °C)',
}

/**
 * ρ(t) = (999.83952 + 16.945176 t − 7.9870401e−3 t² − 46.170461e−6 t³ + 105.56302e−9 t⁴ − 280.54253e−12 t⁵)
 *        / (1 + 16.879850e−3 t),  t in °C, ρ in kg/m³ (Kell 1975). Valid 0–150 °C at 1 atm
 * (above 100 °C only for liquid under its vapour pressure; we flag t > 100 °C at 0.1 MPa).
 */
export function waterDensity(temperature: Kelvin): KilogramsPerCubicMetre {
  const t = temperature - 273.15
  const numerator =
    999.83952 +
    16.945176 * t -
    7.9870401e-3 * t ** 2 -
    46.170461e-6 * t ** 3 +
    105.56302e-9 * t ** 4 -
    280.54253e-12 * t ** 5
  return (numerator / (1 + 16.87985e-3 * t)) as KilogramsPerCubicMetre
}

export const IAPWS_VISCOSITY: Method = {
  id: 'iapws-r12-08-viscosity',
  source:
    'IAPWS R12-08 (2008), Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary Water Substance, eqs. 10–12 ' +
    '(μ = μ0(T)·μ1(T,ρ), critical enhancement μ2 = 1, as the release allows outside the critical region), ' +
    'with the density at 0.1 MPa from Kell (1975)',
}

const H0 = [1.67752, 2.20462, 0.6366564, -0.241605]
// Hij of IAPWS R12-08 Table 2, rows i = 0..5, columns j = 0..6.
const H1 = [
  [5.20094e-1, 2.22531e-1, -2.81378e-1, 1.61913e-1, -3.25372e-2, 0, 0],
  [8.50895e-2, 9.99115e-1, -9.06851e-1, 2.57399e-1, 0, 0, 0],
  [-1.08374, 1.88797, -7.72479e-1, 0, 0, 0, 0],
  [-2.89555e-1, 1.26613, -4.89837e-1, 0, 6.98452e-2, 0, -4.35673e-3],
  [0, 0, -2.5704e-1, 0, 0, 8.72102e-3, 0],
  [0, 1.20573e-1, 0, 0, 0, 0, -5.93264e-4],
]

/**
 * IAPWS R12-08 viscosity from temperature and density, without the critical enhancement.
 * Reference values T* = 647.096 K, ρ* = 322 kg/m³, μ* = 1e−6 Pa·s.
 */
export function iapwsViscosity(temperature: Kelvin, density: KilogramsPerCubicMetre): PascalSeconds {
  const t = temperature / CRITICAL_TEMPERATURE
  const rho = density / 322
  let denominator = 0
  for (let i = 0; i < 4; i++) denominator += H0[i]! / t ** i
  const mu0 = (100 * Math.sqrt(t)) / denominator
  let sum = 0
  for (let i = 0; i < 6; i++) {
    let inner = 0
    for (let j = 0; j < 7; j++) inner += H1[i]![j]! * (rho - 1) ** j
    sum += (1 / t - 1) ** i * inner
  }
  return (mu0 * Math.exp(rho * sum) * 1e-6) as PascalSeconds
}

/** Liquid water at 0.1 MPa: IAPWS R12-08 with Kell's density. Valid 0–100 °C (liquid at 0.1 MPa). */
export function waterViscosity(temperature: Kelvin): PascalSeconds {
  return iapwsViscosity(temperature, waterDensity(temperature))
}

/** Range in which all three water correlations are used as valid here: liquid at 0.1 MPa. */
export const waterLiquidRange = { min: 273.15, max: 373.15 } as const
