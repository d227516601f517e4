// The editor's set-up panels: layers, operating points, a channel's points and the outline's clear button.
import { flushPromises, mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import { defineComponent, h } from 'vue'
import { parseChipDocument, type ChipDocument } from '../../../shared/schemas/chip'
import EditorInspector from '../../../components/editor/EditorInspector.vue'
import EditorLayers from '../../../components/editor/EditorLayers.vue'
import EditorOperatingPoint from '../../../components/editor/EditorOperatingPoint.vue'
import { provideCanvasFocus } from '../../../components/editor/lib/focusCanvas'
import fixture from '../../fixtures/documents/t-junction-basic.json'

const doc = (): ChipDocument => {
  const r = parseChipDocument(structuredClone(fixture))
  if (!r.ok) throw new Error('fixture')
  return r.document
}
const withLayer = (): ChipDocument => ({
  ...doc(),
  layers: [...doc().layers, { id: 'deep', name: 'Reservoirs', depth: 150 }],
})

describe('EditorLayers', () => {
  it('lists each layer with its depth and what it holds; a layer in use cannot be removed, an empty one can', async () => {
    const w = mount(EditorLayers, { props: { document: withLayer(), active: 'ch50' } })
    expect(w.get('[data-test="layer-row-ch50"]').text()).toContain('drawing here · 7 elements')
    expect((w.get('[data-test="field-layer-depth-deep"]').element as HTMLInputElement).value).toBe('150')
    expect(w.get('[data-test="layer-remove-ch50"]').attributes('disabled')).toBeDefined()
    await w.get('[data-test="layer-remove-deep"]').trigger('click')
    expect(w.emitted('remove')![0]).toEqual(['deep'])
  })

  it('emits a new depth, a new name, the layer to draw on and a new layer; refuses a zero depth with the schema message', async () => {
    const w = mount(EditorLayers, { props: { document: withLayer(), active: 'ch50' } })
    await w.get('[data-test="field-layer-depth-deep"]').setValue('0')
    await w.get('[data-test="field-layer-depth-deep"]').trigger('change')
    expect(w.emitted('set')).toBeUndefined()
    expect(w.get('[data-test="error-layer-depth-deep"]').text()).toContain('Layer depth must be > 0 µm')
    // setValue fires input and change, as typing then leaving the box does.
    await w.get('[data-test="field-layer-depth-deep"]').setValue('120')
    await w.get('[data-test="layer-name-deep"]').setValue('Drop reservoir')
    expect(w.emitted('set')).toEqual([
      ['deep', 'depth', 120],
      ['deep', 'name', 'Drop reservoir'],
    ])
    await w.get('[data-test="layer-active-deep"]').setValue(true)
    expect(w.emitted('active')![0]).toEqual(['deep'])
    await w.get('[data-test="field-layer-new-depth"]').setValue('25')
    await w.get('[data-test="field-layer-new-depth"]').trigger('change')
    expect(w.emitted('add')![0]).toEqual([25])
  })
})

describe('EditorOperatingPoint: typing while the forecast updates', () => {
  it('keeps what is being typed in an inlet box and the temperature when the panel re-renders before Enter', async () => {
    const w = mount(EditorOperatingPoint, { props: { document: doc() } })
    const box = w.get('[data-test^="inlet-value-"]')
    const input = box.element as HTMLInputElement
    input.value = '-1'
    await box.trigger('input')
    const temperature = w.get('[data-test="op-temperature"]')
    ;(temperature.element as HTMLInputElement).value = '3'
    await temperature.trigger('input')
    // A live forecast answer arrives: new props, the rows re-render (Vue re-applies every bound value).
    await w.setProps({ document: doc(), solution: {} })
    expect(input.value).toBe('-1')
    expect((temperature.element as HTMLInputElement).value).toBe('3')
    await box.trigger('change')
    expect(w.get('[data-test^="inlet-error-"]').text()).toContain('must be ≥ 0')
    expect(w.emitted('inlet')).toBeUndefined()
  })
})

describe('EditorOperatingPoint: several named points', () => {
  it('adds a point from the active one, renames it, and cannot remove the only one', async () => {
    const w = mount(EditorOperatingPoint, { props: { document: doc() } })
    expect(w.get('[data-test="op-remove"]').attributes('disabled')).toBeDefined()
    await w.get('[data-test="op-add"]').trigger('click')
    expect(w.emitted('add')![0]).toEqual(['op-1'])
    await w.get('[data-test="op-name"]').setValue('Slow start')
    await w.get('[data-test="op-name"]').trigger('change')
    expect(w.emitted('field')![0]).toEqual(['op-1', 'name', 'Slow start'])
    const sent = w.emitted('field')!.length
    await w.get('[data-test="op-name"]').setValue('  ')
    expect(w.emitted('field')).toHaveLength(sent)
    expect(w.get('[data-test="op-name-error"]').text()).toBe('Operating point name must not be empty')
  })

  it('with two points, shows the active one, switches and removes', async () => {
    const d = doc()
    const two = {
      ...d,
      operatingPoints: [...d.operatingPoints, { ...d.operatingPoints[0]!, id: 'op-2', name: 'Fast' }],
      activeOperatingPoint: 'op-2',
    }
    const w = mount(EditorOperatingPoint, { props: { document: two } })
    expect((w.get('[data-test="op-name"]').element as HTMLInputElement).value).toBe('Fast')
    await w.get('[data-test="op-active"]').setValue('op-1')
    expect(w.emitted('active')![0]).toEqual(['op-1'])
    await w.get('[data-test="op-remove"]').trigger('click')
    expect(w.emitted('remove')![0]).toEqual(['op-2'])
  })
})

describe('EditorInspector: channels and the outline', () => {
  it("shows a channel's points: ends on terminals named, bends as exact numbers; emits a moved bend and a removal", async () => {
    const w = mount(EditorInspector, { props: { document: doc(), selection: ['water-feed'] } })
    expect(w.get('[data-test="point-0-on"]').text()).toContain('on water-in · port')
    expect(w.get('[data-test="point-2-on"]').text()).toContain('on tj-1 · dispersed')
    expect((w.get('[data-test="field-points.1.x"]').element as HTMLInputElement).value).toBe('5000')
    await w.get('[data-test="field-points.1.y"]').setValue('5200')
    await w.get('[data-test="field-points.1.y"]').trigger('change')
    expect(w.emitted('set')![0]).toEqual(['water-feed', 'points.1.y', 5200])
    await w.get('[data-test="point-remove-1"]').trigger('click')
    expect(w.emitted('removePoint')![0]).toEqual(['water-feed', 1])
  })

  it('a two-point channel offers no removal', () => {
    const w = mount(EditorInspector, { props: { document: doc(), selection: ['oil-feed'] } })
    expect(w.get('[data-test="point-remove-0"]').attributes('disabled')).toBeDefined()
    expect(w.get('[data-test="point-remove-1"]').attributes('disabled')).toBeDefined()
  })

  it('with nothing selected and an outline drawn, offers to clear it', async () => {
    const w = mount(EditorInspector, { props: { document: doc(), selection: [] } })
    await w.get('[data-test="outline-clear"]').trigger('click')
    expect(w.emitted('clearOutline')).toHaveLength(1)
    const none = { ...doc() }
    delete (none as Partial<ChipDocument>).outline
    expect(
      mount(EditorInspector, { props: { document: none, selection: [] } })
        .find('[data-test="outline-clear"]')
        .exists(),
    ).toBe(false)
  })

  it('checks an outline size with the outline schema: a zero height is refused with its message, a new width is sent', async () => {
    const w = mount(EditorInspector, { props: { document: doc(), selection: [] } })
    await w.get('[data-test="field-outline.height"]').setValue('0')
    expect(w.get('[data-test="error-outline.height"]').text()).toContain('Chip outline height must be > 0 µm')
    expect(w.emitted('outline')).toBeUndefined()
    await w.get('[data-test="field-outline.width"]').setValue('12000')
    expect(w.emitted('outline')![0]).toEqual([{ width: 12000 }])
  })
})

describe("EditorOperatingPoint: the editor's one number box", () => {
  // A parent that gives the panel the workspace's "focus the drawing" hook, as EditorWorkspace does.
  const withCanvas = (focused: string[], document = doc()) =>
    mount(
      defineComponent({
        setup() {
          provideCanvasFocus(() => focused.push('canvas'))
          return () =>
            h(EditorOperatingPoint, {
              document,
              onInlet: (...a: unknown[]) => focused.push(`inlet ${JSON.stringify(a)}`),
              onField: (...a: unknown[]) => focused.push(`field ${JSON.stringify(a)}`),
            })
        },
      }),
    )

  it('Enter in an inlet box commits once and hands the keyboard to the drawing; a refused Enter keeps it', async () => {
    const focused: string[] = []
    const w = withCanvas(focused)
    const box = w.get('[data-test="inlet-value-water-in"]')
    await box.setValue('abc')
    await box.trigger('keydown', { key: 'Enter' })
    await flushPromises()
    expect(w.get('[data-test="inlet-error-water-in"]').text()).toContain('Enter a number')
    expect(focused).toEqual([])
    await box.setValue('3')
    await box.trigger('keydown', { key: 'Enter' })
    await box.trigger('change')
    await flushPromises()
    expect(focused).toEqual([
      `inlet ${JSON.stringify(['op-1', { portId: 'water-in', mode: 'flow', value: 3, unit: 'uL/min' }])}`,
      'canvas',
    ])
    expect(w.find('[data-test="inlet-error-water-in"]').exists()).toBe(false)
  })

  it('the temperature box: Enter commits a valid value and hands the keyboard over; −1000 °C is refused and stays typed', async () => {
    const focused: string[] = []
    const w = withCanvas(focused)
    const t = w.get('[data-test="op-temperature"]')
    await t.setValue('-1000')
    await t.trigger('keydown', { key: 'Enter' })
    await flushPromises()
    expect(w.get('[data-test="op-temperature-error"]').text()).toContain('between −20 °C and 150 °C')
    expect((t.element as HTMLInputElement).value).toBe('-1000')
    expect(focused).toEqual([])
    ;(t.element as HTMLInputElement).value = '25'
    await t.trigger('input')
    await t.trigger('keydown', { key: 'Enter' })
    await flushPromises()
    expect(w.find('[data-test="op-temperature-error"]').exists()).toBe(false)
    expect(focused).toEqual([`field ${JSON.stringify(['op-1', 'temperatureC', 25])}`, 'canvas'])
  })
})
