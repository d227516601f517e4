// Forecast quantities (SI inside) shown in the trade's units with sensible significant figures.
import type { Quantity } from '#shared/physics/quantity'

const sig = (v: number, n = 3) => (v === 0 ? '0' : Math.abs(v) < 1e-3 || Math.abs(v) >= 1e5 ? v.toExponential(n - 1) : String(Number(v.toPrecision(n))))

export function showQuantity(key: string, q: Quantity | { value: unknown; unit?: string }): string {
  const v = q.value
  if (typeof v !== 'number') return String(v)
  switch (q.unit) {
    case 'm': return `${sig(v * 1e6)} µm`
    case 'm^3': return v < 1e-12 ? `${sig(v * 1e15)} pL` : `${sig(v * 1e12)} nL`
    case 'Hz': return v >= 1000 ? `${sig(v / 1000)} kHz` : `${sig(v)} Hz`
    case 'Pa': return `${sig(v / 100)} mbar`
    case '1': case '': return sig(v)
    default: return key === 'regime' ? String(v) : `${sig(v)} ${q.unit}`
  }
}
