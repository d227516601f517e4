import { z } from 'zod'
import { safeText } from '../text'
import { CHIP_LIMITS as L, shownLimit } from './limits'
import { elementId } from './primitives'

const ranged = (what: string, unit: string, { min, max }: { min: number; max: number }) =>
  z
    .number({ error: `${what} must be a finite number in ${unit}` })
    .positive({ error: `${what} must be > 0 ${unit}`, abort: true })
    .min(min, { error: `${what} must be at least ${min} ${unit}` })
    .max(max, { error: `${what} must be at most ${shownLimit(max)} ${unit}` })

const name = (what: string) =>
  safeText({ error: `${what} must be a string` }, what).max(L.nameChars, {
    error: `${what} must be at most ${L.nameChars} characters`,
  })

/**
 * A liquid: either a library entry (`liquid` id, e.g. "water", "glycerol-water" with `massFraction`) or explicit
 * properties with their units in the field names.
 */
export const liquidRef = z.union(
  [
    z.object({
      liquid: name('Liquid id').min(1, { error: 'Liquid id must not be empty' }),
      massFraction: z.number().min(0).max(1, { error: 'Mass fraction must be between 0 and 1' }).optional(),
    }),
    z.object({
      name: name('Liquid name').optional(),
      viscosityMPaS: ranged('Viscosity', 'mPa·s', L.viscosityMPaS),
      densityKgPerM3: ranged('Density', 'kg/m³', L.densityKgPerM3),
    }),
  ],
  {
    // Neither shape fits: a broken text inside says so (a NUL in the liquid id), else which shapes there are.
    error: iss => {
      const inner = ((iss as { errors?: z.core.$ZodIssue[][] }).errors ?? [])
        .flat()
        .find(i => i.code === 'custom' && /NUL character|lone UTF-16 surrogate/.test(i.message))
      return inner?.message ?? 'Liquid must be { liquid: <library id> } or { viscosityMPaS, densityKgPerM3 }'
    },
  },
)
export type LiquidRef = z.infer<typeof liquidRef>

/** Conversions to the unit the limit is stated in (1 psi = 68.948 mbar, NIST SP 811 appendix B). */
const MBAR_PER = { mbar: 1, kPa: 10, psi: 68.947_57 } as const
const UL_PER_MIN_PER = { 'uL/min': 1, 'uL/h': 1 / 60, 'nL/min': 1e-3 } as const

/** How one inlet is driven at this operating point. */
export const inletSetting = z.discriminatedUnion(
  'mode',
  [
    z
      .object({
        portId: elementId,
        mode: z.literal('pressure'),
        value: z.number().nonnegative({ error: 'Inlet pressure must be ≥ 0' }),
        unit: z.enum(['mbar', 'kPa', 'psi'], { error: 'Pressure unit must be "mbar", "kPa" or "psi"' }),
      })
      .refine(s => s.value * MBAR_PER[s.unit] <= L.pressureMbar, {
        path: ['value'],
        error: `Inlet pressure must be at most ${shownLimit(L.pressureMbar)} mbar (10 MPa)`,
      }),
    z
      .object({
        portId: elementId,
        mode: z.literal('flow'),
        value: z.number().nonnegative({ error: 'Inlet flow rate must be ≥ 0' }),
        unit: z.enum(['uL/min', 'uL/h', 'nL/min'], { error: 'Flow unit must be "uL/min", "uL/h" or "nL/min"' }),
      })
      .refine(s => s.value * UL_PER_MIN_PER[s.unit] <= L.flowUlPerMin, {
        path: ['value'],
        error: `Inlet flow rate must be at most ${shownLimit(L.flowUlPerMin)} µL/min`,
      }),
  ],
  { error: 'Inlet mode must be "pressure" or "flow"' },
)
export type InletSetting = z.infer<typeof inletSetting>

export const operatingPoint = z.object({
  id: elementId,
  name: name('Operating point name').min(1, { error: 'Operating point name must not be empty' }),
  temperatureC: z
    .number()
    .min(-20, { error: 'Temperature must be between −20 °C and 150 °C' })
    .max(150, { error: 'Temperature must be between −20 °C and 150 °C' })
    .default(20),
  continuousLiquid: liquidRef,
  dispersedLiquid: liquidRef,
  surfactant: name('Surfactant').min(1).optional(),
  interfacialTensionMNPerM: ranged('Interfacial tension', 'mN/m', L.tensionMNPerM).optional(),
  contactAngleDeg: z.number().min(0).max(180, { error: 'Contact angle must be between 0° and 180°' }).optional(),
  inlets: z.array(inletSetting).max(L.inletsPerOperatingPoint, {
    error: `An operating point can set at most ${shownLimit(L.inletsPerOperatingPoint)} inlets`,
  }),
})
export type OperatingPoint = z.infer<typeof operatingPoint>
