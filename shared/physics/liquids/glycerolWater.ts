// Glycerol–water mixtures: viscosity by Cheng (2008), densities as used there.
import type { Method } from '../quantity'
import type { Kelvin, KilogramsPerCubicMetre, PascalSeconds } from '../units'

export const CHENG_VISCOSITY: Method = {
  id: 'cheng-2008-glycerol-water-viscosity',
  source:
    'Cheng N.-S. (2008) Formula for the viscosity of a glycerol–water mixture, Ind. Eng. Chem. Res. 47, 3285–3288, eqs. 5–8',
}

export const CHENG_DENSITY: Method = {
  id: 'cheng-2008-glycerol-water-density',
  source:
    'Component densities as used by Cheng (2008), Ind. Eng. Chem. Res. 47, 3285 (ρg = 1273.3 − 0.6121 t, ρw = 1000(1 − |(t − 4)/622|^1.7)); ' +
    'mixed by ideal volume additivity, which underestimates the real mixture by up to about 1 % (typical value, from memory)',
}

/** Temperature range of the data Cheng fitted (0–100 °C); mass fraction 0–1. */
export const chengRange = { min: 273.15, max: 373.15 } as const

/**
 * μ = μw^α μg^(1−α), α = 1 − Cm + a b Cm (1 − Cm) / (a Cm + b (1 − Cm)), a = 0.705 − 0.0017 t,
 * b = (4.9 + 0.036 t) a^2.5, μg = 12100 exp[(−1233 + t) t / (9900 + 70 t)] mPa·s,
 * μw = 1.790 exp[(−1230 − t) t / (36100 + 360 t)] mPa·s, t in °C, Cm glycerol mass fraction (Cheng 2008).
 */
export function glycerolWaterViscosity(temperature: Kelvin, massFraction: number): PascalSeconds {
  const t = temperature - 273.15
  const cm = massFraction
  const a = 0.705 - 0.0017 * t
  const b = (4.9 + 0.036 * t) * a ** 2.5
  const alpha = 1 - cm + (a * b * cm * (1 - cm)) / (a * cm + b * (1 - cm))
  const muGlycerol = 12100 * Math.exp(((-1233 + t) * t) / (9900 + 70 * t))
  const muWater = 1.79 * Math.exp(((-1230 - t) * t) / (36100 + 360 * t))
  return (muWater ** alpha * muGlycerol ** (1 - alpha) * 1e-3) as PascalSeconds
}

/** Ideal-mixing density from Cheng's component densities: 1/ρ = Cm/ρg + (1 − Cm)/ρw. */
export function glycerolWaterDensity(temperature: Kelvin, massFraction: number): KilogramsPerCubicMetre {
  const t = temperature - 273.15
  const rhoGlycerol = 1273.3 - 0.6121 * t
  const rhoWater = 1000 * (1 - Math.abs((t - 4) / 622) ** 1.7)
  return (1 / (massFraction / rhoGlycerol + (1 - massFraction) / rhoWater)) as KilogramsPerCubicMetre
}
