import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import { parseChipDocument, type ChipDocument } from '../../../shared/schemas/chip'
import EditorInspector from '../../../components/editor/EditorInspector.vue'
import EditorOperatingPoint from '../../../components/editor/EditorOperatingPoint.vue'
import fixture from '../../fixtures/documents/t-junction-basic.json'

const doc = (): ChipDocument => { const r = parseChipDocument(structuredClone(fixture)); if (!r.ok) throw new Error('fixture'); return r.document }

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
    const w = mount(EditorInspector, { props: { document: doc(), selection: ['tj-1', 'oil-in'], refusal: 'Channel needs at least 2 points' } })
    expect(w.text()).toContain('2 elements selected')
    expect(w.get('[data-test="edit-refused"]').text()).toContain('Channel needs at least 2 points')
  })
})

describe('EditorOperatingPoint', () => {
  it('lists the inlets with their settings and the pressure each needs, and emits a new flow', async () => {
    const w = mount(EditorOperatingPoint, { props: { document: doc(), pressures: { 'oil-in': 123.456 } } })
    expect(w.get('[data-test="inlet-oil-in"]').text()).toContain('123 mbar')
    await w.get('[data-test="inlet-value-water-in"]').setValue('3')
    await w.get('[data-test="inlet-value-water-in"]').trigger('change')
    expect(w.emitted('inlet')![0]).toEqual(['op-1', { portId: 'water-in', mode: 'flow', value: 3, unit: 'uL/min' }])
  })
})
