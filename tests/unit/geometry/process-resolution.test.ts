// One resolution of "which process": a design's process id among the built-in processes and its lab's, and the
// process of a revision from the values stored with it (a later library edit never changes a released sheet).
import { describe, expect, it } from 'vitest'
import {
  BUILT_IN_PROCESSES,
  labProcess,
  processFromSnapshot,
  processSnapshot,
  processValuesSource,
  resolveProcess,
  revisionProcess,
  snapshotAsLabData,
  type LabProcessData,
} from '~~/geometry/rules'
import { inletLine, phasesLine, processLine, processSourceLine, temperatureLine } from '#shared/fabrication/fabSheet'

// Invented values: a lab's own fine-feature process.
const FINE: LabProcessData = {
  id: 'lab-fine',
  name: 'Our fine SU-8 process',
  material: 'PDMS',
  minFeature: 5,
  minGap: 6,
  minDepth: 2,
  maxDepth: 80,
  maxWidthToDepth: 12,
  maxWallDepthToWidth: 3,
  portEdgeDistance: 900,
  portSpacing: 800,
  bondPressureLimitMbar: 1500,
  source: 'measured in our lab',
}

describe('resolveProcess', () => {
  it('finds built-in and lab processes; the first built-in one when the id is unknown or missing', () => {
    expect(resolveProcess('lab-fine', [FINE])).toMatchObject({
      id: 'lab-fine',
      minFeature: 5,
      bondPressureLimitMbar: 1500,
      origin: 'lab',
    })
    expect(resolveProcess('chrome-mask-soft-litho', [FINE]).minFeature).toBe(3)
    expect(resolveProcess('lab-fine').id).toBe(BUILT_IN_PROCESSES[0]!.id) // another lab's (or an archived) process is not known here
    expect(resolveProcess(undefined, [FINE]).id).toBe(BUILT_IN_PROCESSES[0]!.id)
  })
})

describe('revisionProcess', () => {
  it('rebuilds a lab process from the snapshot, with its name, values and source, whatever the library says now', () => {
    const stored = { processId: 'lab-fine', library: { process: processSnapshot(labProcess(FINE)) } }
    expect(stored.library.process).toMatchObject({
      id: 'lab-fine',
      name: 'Our fine SU-8 process',
      origin: 'lab',
      source: 'measured in our lab',
      values: { minFeature: 5, bondPressureLimitMbar: 1500, material: 'PDMS' },
    })
    const edited = { ...FINE, minFeature: 50, bondPressureLimitMbar: 500 } // the admin edits the entry after the release
    const p = revisionProcess(stored, [edited])
    expect(p).toMatchObject({
      id: 'lab-fine',
      name: 'Our fine SU-8 process',
      minFeature: 5,
      minGap: 6,
      maxDepth: 80,
      bondPressureLimitMbar: 1500,
    })
    expect(processValuesSource(p)).toContain('measured in our lab')
    expect(processValuesSource(p)).toContain('as stored with the revision')
  })

  it("keeps a built-in process's own sources; a summary without a snapshot resolves its id among the lab's", () => {
    const film = revisionProcess({
      processId: 'film-mask-soft-litho',
      library: { process: processSnapshot(BUILT_IN_PROCESSES[0]!) },
    })
    expect(film.sources).toEqual(BUILT_IN_PROCESSES[0]!.sources)
    expect(processValuesSource(film)).toBe('common practice, no source')
    expect(revisionProcess({ processId: 'lab-fine' }, [FINE]).minFeature).toBe(5)
    expect(revisionProcess({ processId: 'lab-fine' }).id).toBe(BUILT_IN_PROCESSES[0]!.id)
  })

  it('a snapshot as lab data checks another chip with the same values (the as-built)', () => {
    const back = snapshotAsLabData(processSnapshot(labProcess(FINE)))!
    expect(back).toEqual(FINE)
    expect(snapshotAsLabData(processSnapshot(BUILT_IN_PROCESSES[0]!))).toBeNull()
  })

  it('an older snapshot without the lab source still says where its values were kept', () => {
    const { source: _s, ...old } = processSnapshot(labProcess(FINE))
    void _s
    expect(processValuesSource(processFromSnapshot(old))).toBe(
      "the lab's own values; the lab's library, as stored with the revision",
    )
  })
})

describe('fab sheet lines', () => {
  it('format every number through shared/format', () => {
    expect(processLine(resolveProcess('lab-fine', [FINE]))).toBe(
      'Our fine SU-8 process: minimum feature 5 µm, minimum gap 6 µm, depths 2 µm to 80 µm, bond limit 1500 mbar',
    )
    expect(processSourceLine(resolveProcess('lab-fine', [FINE]))).toBe(
      "values: measured in our lab (the lab's library)",
    )
    expect(inletLine({ portId: 'oil-in', mode: 'flow', value: 10, unit: 'uL/min' })).toBe('oil-in: flow rate 10 µL/min')
    expect(inletLine({ portId: 'water-in', mode: 'pressure', value: 1234.5678, unit: 'mbar' })).toBe(
      'water-in: pressure 1234.57 mbar',
    )
    expect(inletLine({ portId: 'water-in', mode: 'flow', value: 0.1 + 0.2, unit: 'uL/h' })).toBe(
      'water-in: flow rate 0.3 µL/h',
    )
    expect(temperatureLine(22)).toBe('22 °C')
  })

  it("name the active operating point's liquids as stored with the revision (a lab liquid by its name, not its id)", () => {
    const op = {
      id: 'op-1',
      continuousLiquid: { liquid: 'lab-test-oil' },
      dispersedLiquid: { liquid: 'water' },
      surfactant: 'our-mix',
      temperatureC: 22,
    }
    const stored = {
      id: 'lab-test-oil',
      name: 'Test oil, lot 1',
      origin: 'lab' as const,
      viscosityMPaS: 6,
      densityKgPerM3: 830,
      source: 'measured in our lab',
    }
    const library = {
      operatingPoint: 'op-1',
      temperatureC: 22,
      continuous: stored,
      dispersed: { ...stored, id: 'water', name: 'water', origin: 'built-in' as const },
      surfactant: 'our-mix',
      interfacialTension: null,
      process: processSnapshot(BUILT_IN_PROCESSES[0]!),
    }
    expect(phasesLine(op, library)).toBe(
      'Continuous phase Test oil, lot 1, dispersed phase water, surfactant our-mix, 22 °C',
    )
    // Another operating point than the one stored, or no snapshot: the ids as the document names them.
    expect(phasesLine({ ...op, id: 'op-2' }, library)).toBe(
      'Continuous phase lab-test-oil, dispersed phase water, surfactant our-mix, 22 °C',
    )
    expect(phasesLine({ ...op, continuousLiquid: { viscosityMPaS: 5 }, surfactant: null }, null)).toBe(
      'Continuous phase custom properties, dispersed phase water, 22 °C',
    )
  })
})
