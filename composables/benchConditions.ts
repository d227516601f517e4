// What is typed at the bench for one run: flows, pressures and temperature, as the run form holds them, and the
// `conditions` of the shared schema they become (shared/schemas/bench.ts). An empty field keeps the design's value.
import type { BenchConditions } from '#shared/schemas/bench'

export type TypedNumber = number | '' | null
export interface BenchFieldValues {
  qc: TypedNumber
  qd: TypedNumber
  pc: TypedNumber
  pd: TypedNumber
  temperature: TypedNumber
}

export const emptyBenchFields = (): BenchFieldValues => ({ qc: null, qd: null, pc: null, pd: null, temperature: null })

/** A number that was typed; an empty field (v-model.number gives '' once cleared) is undefined. */
export const typedNumber = (v: TypedNumber): number | undefined => (v === '' || v === null ? undefined : v)

export function benchConditionsOf(v: BenchFieldValues): Partial<BenchConditions> {
  const c: Partial<BenchConditions> = {}
  const qc = typedNumber(v.qc)
  const qd = typedNumber(v.qd)
  if (qc !== undefined) c.continuousFlow = { value: qc, unit: 'uL/min' }
  if (qd !== undefined) c.dispersedFlow = { value: qd, unit: 'uL/min' }
  if (typedNumber(v.pc) !== undefined) c.continuousPressureMbar = typedNumber(v.pc)
  if (typedNumber(v.pd) !== undefined) c.dispersedPressureMbar = typedNumber(v.pd)
  if (typedNumber(v.temperature) !== undefined) c.temperatureC = typedNumber(v.temperature)
  return c
}

/** Each field, where the shared schema reports its problem, and its label. */
export const BENCH_FIELDS = [
  {
    key: 'qc',
    path: 'conditions.continuousFlow.value',
    label: 'Continuous flow at the bench (µL/min)',
    test: 'bench-qc',
    span: 1,
    min: 0,
  },
  {
    key: 'qd',
    path: 'conditions.dispersedFlow.value',
    label: 'Dispersed flow at the bench (µL/min)',
    test: 'bench-qd',
    span: 1,
    min: 0,
  },
  {
    key: 'temperature',
    path: 'conditions.temperatureC',
    label: 'Temperature at the bench (°C)',
    test: 'bench-temperature',
    span: 2,
    min: undefined,
  },
  {
    key: 'pc',
    path: 'conditions.continuousPressureMbar',
    label: '…or continuous pressure (mbar)',
    test: 'bench-pc',
    span: 1,
    min: 0,
  },
  {
    key: 'pd',
    path: 'conditions.dispersedPressureMbar',
    label: '…or dispersed pressure (mbar)',
    test: 'bench-pd',
    span: 1,
    min: 0,
  },
] as const satisfies ReadonlyArray<{
  key: keyof BenchFieldValues
  path: string
  label: string
  test: string
  span: number
  min: number | undefined
}>
