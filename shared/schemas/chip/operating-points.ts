import { z } from 'zod'
import { elementId } from './primitives'

/**
 * A liquid: either a library entry (`liquid` id, e.g. "water", "glycerol-water" with `massFraction`) or explicit
 * properties with their units in the field names.
 */
export const liquidRef = z.union([
  z.object({
    liquid: z.string().min(1, { error: 'Liquid id must not be empty' }),
    massFraction: z.number().min(0).max(1, { error: 'Mass fraction must be between 0 and 1' }).optional(),
  }),
  z.object({
    name: z.string().optional(),
    viscosityMPaS: z.number().positive({ error: 'Viscosity must be > 0 mPa·s' }),
    densityKgPerM3: z.number().positive({ error: 'Density must be > 0 kg/m³' }),
  }),
], { error: 'Liquid must be { liquid: <library id> } or { viscosityMPaS, densityKgPerM3 }' })
export type LiquidRef = z.infer<typeof liquidRef>

/** How one inlet is driven at this operating point. */
export const inletSetting = z.discriminatedUnion('mode', [
  z.object({
    portId: elementId,
    mode: z.literal('pressure'),
    value: z.number().nonnegative({ error: 'Inlet pressure must be ≥ 0' }),
    unit: z.enum(['mbar', 'kPa', 'psi'], { error: 'Pressure unit must be "mbar", "kPa" or "psi"' }),
  }),
  z.object({
    portId: elementId,
    mode: z.literal('flow'),
    value: z.number().nonnegative({ error: 'Inlet flow rate must be ≥ 0' }),
    unit: z.enum(['uL/min', 'uL/h', 'nL/min'], { error: 'Flow unit must be "uL/min", "uL/h" or "nL/min"' }),
  }),
], { error: 'Inlet mode must be "pressure" or "flow"' })
export type InletSetting = z.infer<typeof inletSetting>

export const operatingPoint = z.object({
  id: elementId,
  name: z.string().min(1, { error: 'Operating point name must not be empty' }),
  temperatureC: z.number().min(-20).max(150, { error: 'Temperature must be between −20 °C and 150 °C' }).default(20),
  continuousLiquid: liquidRef,
  dispersedLiquid: liquidRef,
  surfactant: z.string().min(1).optional(),
  interfacialTensionMNPerM: z.number().positive({ error: 'Interfacial tension must be > 0 mN/m' }).optional(),
  contactAngleDeg: z.number().min(0).max(180, { error: 'Contact angle must be between 0° and 180°' }).optional(),
  inlets: z.array(inletSetting),
})
export type OperatingPoint = z.infer<typeof operatingPoint>
