import { planParallelChip } from '~~/geometry/arrays'
import { buildOutlines } from '~~/geometry/outlines'
import { documentPieces } from '~~/geometry/outlines/elements'
import { BUILT_IN_PROCESSES, checkDesignRules } from '~~/geometry/rules'
import { exportDxf } from '~~/geometry/dxf'
const p = BUILT_IN_PROCESSES[0]!
const big = planParallelChip({ nozzles: 16384, unbounded: true }).document
const t = (l: string, f: () => unknown) => { const s = performance.now(); const v = f(); console.log(l, (performance.now() - s).toFixed(0)); return v }
for (let i = 0; i < 2; i++) {
  t('pieces', () => documentPieces(big, 0.1))
  const o = t('outlines', () => buildOutlines(big)) as ReturnType<typeof buildOutlines>
  t('rules sizing', () => checkDesignRules(big, p, { outlines: o }))
  t('rules edges', () => checkDesignRules(big, p, { outlines: o, spacing: 'edges' }))
  t('dxf', () => exportDxf(big, { outlines: o, date: '2026-01-01' }))
}
