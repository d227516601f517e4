import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import { parseChipDocument, type ChipDocument } from '../../../shared/schemas/chip'
import EditorInspector from '../../../components/editor/EditorInspector.vue'
import EditorOperatingPoint from '../../../components/editor/EditorOperatingPoint.vue'
import fixture from '../../fixtures/documents/t-junction-basic.json'

const doc = (): ChipDocument => {
  const r = parseChipDocument(structuredClone(fixture))
  if (!r.ok) throw new Error('fixture')
  return r.document
}

describe('EditorInspector', () => {
  it('shows the selected junction with exact numbers and units', () => {
    const w = mount(EditorInspector, { props: { document: doc(), selection: ['tj-1'] } })
    expect(w.get('[data-test="inspector-id"]').text()).toBe('tj-1')
    expect((w.get('[data-test="field-mainWidth"]').element as HTMLInputElement).value).toBe('100')
    expect(w.text()).toContain('µm')
    expect(w.text()).toContain('Channels · 50 µm deep')
  })

  it('emits a valid edit', async () => {
    const w = mount(EditorInspector, { props: { document: doc(), selection: ['tj-1'] } })
    await w.get('[data-test="field-inletWidth"]').setValue('60')
    await w.get('[data-test="field-inletWidth"]').trigger('change')
    expect(w.emitted('set')![0]).toEqual(['tj-1', 'inletWidth', 60])
  })

  it('refuses a bad value with the schema message and keeps what was typed', async () => {
    const w = mount(EditorInspector, { props: { document: doc(), selection: ['tj-1'] } })
    const input = w.get('[data-test="field-mainWidth"]')
    await input.setValue('-3')
    await input.trigger('change')
    expect(w.emitted('set')).toBeUndefined()
    expect(w.get('[data-test="error-mainWidth"]').text()).toContain('T-junction main width must be > 0 µm')
    expect((input.element as HTMLInputElement).value).toBe('-3')
    await input.setValue('250')
    await input.trigger('change')
    expect(w.get('[data-test="error-mainWidth"]').text()).toContain('arm length must be ≥ the widest channel (250 µm)')
  })

  it('says what a multiple selection can do, and shows a refusal from the store', () => {
    const w = mount(EditorInspector, {
      props: { document: doc(), selection: ['tj-1', 'oil-in'], refusal: 'Channel needs at least 2 points' },
    })
    expect(w.text()).toContain('2 elements selected')
    expect(w.get('[data-test="edit-refused"]').text()).toContain('Channel needs at least 2 points')
  })
})

describe('EditorOperatingPoint', () => {
  const solution = {
    'oil-in': { pressureMbar: 123.456, flowUlPerMin: 10 },
    'water-in': { pressureMbar: 88.71, flowUlPerMin: 4.9996 },
  }
  it('lists the inlets with their settings and the pressure and flow of each, and emits a new flow', async () => {
    const w = mount(EditorOperatingPoint, { props: { document: doc(), solution } })
    expect(w.get('[data-test="inlet-pressure-oil-in"]').text()).toBe('123 mbar')
    expect(w.get('[data-test="inlet-flow-water-in"]').text()).toBe('5 µL/min')
    await w.get('[data-test="inlet-value-water-in"]').setValue('3')
    await w.get('[data-test="inlet-value-water-in"]').trigger('change')
    expect(w.emitted('inlet')![0]).toEqual(['op-1', { portId: 'water-in', mode: 'flow', value: 3, unit: 'uL/min' }])
  })
  it('switching an inlet to pressure starts from the pressure it needs now, and back to flow from its flow', async () => {
    const w = mount(EditorOperatingPoint, { props: { document: doc(), solution } })
    await w.get('[data-test="inlet-mode-water-in"]').setValue('pressure')
    expect(w.emitted('inlet')![0]).toEqual([
      'op-1',
      { portId: 'water-in', mode: 'pressure', value: 88.7, unit: 'mbar' },
    ])
    const pressured = doc()
    pressured.operatingPoints[0]!.inlets = pressured.operatingPoints[0]!.inlets.map(i =>
      i.portId === 'water-in'
        ? { portId: 'water-in', mode: 'pressure' as const, value: 88.7, unit: 'mbar' as const }
        : i,
    )
    await w.setProps({ document: pressured })
    await w.get('[data-test="inlet-mode-water-in"]').setValue('flow')
    expect(w.emitted('inlet')![1]).toEqual(['op-1', { portId: 'water-in', mode: 'flow', value: 5, unit: 'uL/min' }])
  })
  it('refuses −1 and "abc" beside the field, keeps what was typed and emits nothing', async () => {
    const w = mount(EditorOperatingPoint, { props: { document: doc(), solution } })
    const box = w.get('[data-test="inlet-value-water-in"]')
    await box.setValue('-1')
    await box.trigger('change')
    expect(w.get('[data-test="inlet-error-water-in"]').text()).toContain('Inlet flow rate must be ≥ 0')
    await box.setValue('abc')
    await box.trigger('change')
    expect(w.get('[data-test="inlet-error-water-in"]').text()).toContain('Enter a number')
    expect((box.element as HTMLInputElement).value).toBe('abc')
    await w.get('[data-test="op-temperature"]').setValue('200')
    await w.get('[data-test="op-temperature"]').trigger('change')
    expect(w.get('[data-test="op-temperature-error"]').text()).toContain('between −20 °C and 150 °C')
    expect(w.emitted('inlet')).toBeUndefined()
    expect(w.emitted('field')).toBeUndefined()
  })
  it('marks a pressure above the bond limit', () => {
    const w = mount(EditorOperatingPoint, {
      props: {
        document: doc(),
        solution: { ...solution, 'oil-in': { pressureMbar: 2500, flowUlPerMin: 10 } },
        bondLimitMbar: 2000,
      },
    })
    expect(w.get('[data-test="inlet-pressure-oil-in"]').classes()).toContain('text-fault-500')
    expect(w.get('[data-test="inlet-pressure-water-in"]').classes()).not.toContain('text-fault-500')
  })
})
