// Benchmarks of the planner: a 10,000-point window of one junction and a pressure-driven window of a 64-nozzle
// chip through the network, median times printed. Not a test (budgets: < 200 ms and < 2 s, issue 14).
import { loadavg } from 'node:os'
import { generateParallelChip } from '../../geometry/arrays'
import { resolveJunctionRequest } from '../../shared/physics/forecast/junctionRequest'
import { runPlan, scanJunction } from '../../shared/physics/planner'
import { junctionRequest } from '../../shared/schemas/forecast'
import { forecastDocument } from '../../shared/physics/document'
import { requireChipDocument } from '../../shared/schemas/chip'
import { timed } from './timing'

const ms = (t: number) => `${t.toFixed(1)} ms`

export function run(): void {
  console.log(`\nplanner (load average ${loadavg()[0]!.toFixed(1)} on this machine: figures scale with it)`)
  const request = junctionRequest.parse({
    junction: { kind: 't-junction', mainWidth: '35 um', inletWidth: '25 um', depth: '25 um' },
    continuous: { liquid: 'n-hexadecane' },
    dispersed: { liquid: 'water' },
    surfactant: 'sorbitan-monooleate',
    flow: { continuous: '1 uL/min', dispersed: '1 uL/min' },
  })
  const { junction } = resolveJunctionRequest(request)
  const target = { diameter: 40e-6, volume: (Math.PI / 6) * 40e-6 ** 3, tolerance: 0.05, minFrequency: 500 }
  const box = {
    continuous: [1e-10 / 60, 1e-7 / 60] as [number, number],
    dispersed: [1e-10 / 60, 1e-7 / 60] as [number, number],
  }
  const scan = timed(() => scanJunction(junction, box, 100, target), 9)
  console.log(
    `  window scan, 10,000 points of one T-junction: median ${ms(scan.median)} (worst ${ms(scan.worst)}; budget 200 ms)`,
  )
  const whole = timed(
    () =>
      runPlan({
        junction: { kind: 't-junction', mainWidth: '35 um', inletWidth: '25 um', depth: '25 um' },
        continuous: { liquid: 'n-hexadecane' },
        dispersed: { liquid: 'water' },
        surfactant: 'sorbitan-monooleate',
        target: { dropletDiameter: '40 um', minFrequency: '500 Hz' },
        search: { points: 100 },
        encapsulation: { concentration: '2e6 /mL' },
      }),
    5,
  )
  console.log(`  whole plan at 100 × 100 (window, recommendation, geometry, loading): median ${ms(whole.median)}`)

  const chip = generateParallelChip({ nozzles: 64, name: 'bench ladder' }) as unknown as {
    operatingPoints: Array<Record<string, any>>
  }
  chip.operatingPoints = chip.operatingPoints.map(op => ({ ...op, interfacialTensionMNPerM: 3 }))
  let points = 0
  const pressure = timed(() => {
    const plan = runPlan({ document: chip, target: { dropletDiameter: '32 um', tolerance: 0.1 } })
    points = plan.window.points.length
    if (plan.window.mode.dispersed !== 'pressure') throw new Error('bench chip is not pressure-driven')
  }, 3)
  const one = timed(() => forecastDocument(requireChipDocument(chip)), 9)
  console.log(
    `  pressure-driven window of a 64-nozzle chip through the network (${points} points, each a whole-chip forecast): median ${ms(pressure.median)} (worst ${ms(pressure.worst)}; budget 2 s)`,
  )
  console.log(`    of which one whole-chip forecast of that chip: median ${ms(one.median)}`)
}
