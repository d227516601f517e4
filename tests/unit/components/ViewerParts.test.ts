import { mount } from '@vue/test-utils'
import { describe, expect, it } from 'vitest'
import ViewerCursorReadout from '../../../components/viewer/ViewerCursorReadout.vue'
import ViewerLayerToggles from '../../../components/viewer/ViewerLayerToggles.vue'
import ViewerLegend from '../../../components/viewer/ViewerLegend.vue'
import ViewerScaleBar from '../../../components/viewer/ViewerScaleBar.vue'
import ViewerZoomControls from '../../../components/viewer/ViewerZoomControls.vue'

const layers = [
  { layerId: 'nozzle', name: 'Nozzles (shallow)', depth: 8, color: '#74b4cc' },
  { layerId: 'deep', name: 'Manifolds (deep)', depth: 150, color: '#9f640b' },
]

describe('ViewerLayerToggles', () => {
  it('lists every layer with its depth and emits a toggle without touching its props', async () => {
    const hidden: string[] = ['deep']
    const w = mount(ViewerLayerToggles, { props: { layers, hidden, showMarks: true } })
    expect(w.get('[data-test="layer-nozzle"]').text()).toContain('8 µm deep')
    expect(w.get('[data-test="layer-deep"]').text()).toContain('150 µm deep')
    const boxes = w.findAll('input[type="checkbox"]')
    expect(boxes.map(b => (b.element as HTMLInputElement).checked)).toEqual([true, false, true])
    await boxes[1]!.trigger('change')
    await boxes[2]!.trigger('change')
    expect(w.emitted('toggle')).toEqual([['deep']])
    expect(w.emitted('toggle-marks')).toHaveLength(1)
    expect(hidden).toEqual(['deep'])
  })

  it('writes a depth through shared/format: a 1500 µm reservoir is 1.5 mm deep, a 0.5 µm film 500 nm', () => {
    const w = mount(ViewerLayerToggles, {
      props: {
        layers: [
          { ...layers[0]!, depth: 0.5 },
          { ...layers[1]!, depth: 1500 },
        ],
        hidden: [],
        showMarks: true,
      },
    })
    expect(w.get('[data-test="layer-nozzle"]').text()).toContain('500 nm deep')
    expect(w.get('[data-test="layer-deep"]').text()).toContain('1.5 mm deep')
  })
})

describe('ViewerScaleBar', () => {
  it('shows a round length with its unit, drawn to scale', () => {
    const w = mount(ViewerScaleBar, { props: { pixelsPerMicrometre: 0.076, maxPx: 140 } })
    expect(w.text()).toBe('1 mm')
    expect(w.get('svg').attributes('width')).toBe(String(Math.ceil(76) + 2))
  })
  it('follows the zoom', async () => {
    const w = mount(ViewerScaleBar, { props: { pixelsPerMicrometre: 1 } })
    expect(w.text()).toBe('100 µm')
    await w.setProps({ pixelsPerMicrometre: 30 })
    expect(w.text()).toBe('2 µm')
  })
})

describe('ViewerCursorReadout', () => {
  it('shows x and y in µm, or a hint when the cursor is off the chip', async () => {
    const w = mount(ViewerCursorReadout, { props: { point: { x: 5000.04, y: -12.6 }, pixelsPerMicrometre: 0.1 } })
    expect(w.text()).toMatch(/x\s*5000 µm\s*y\s*-13 µm/)
    await w.setProps({ point: null })
    expect(w.text()).toContain('Point at the chip')
  })
})

describe('ViewerLegend and ViewerZoomControls', () => {
  it('counts each kind of change and names the other revision', () => {
    const w = mount(ViewerLegend, { props: { added: 1, removed: 2, changed: 3, otherLabel: 'revision 4' } })
    expect(w.get('[data-test="legend-added"]').text()).toMatch(/Added\s*1/)
    expect(w.get('[data-test="legend-removed"]').text()).toMatch(/Removed\s*2/)
    expect(w.get('[data-test="legend-changed"]').text()).toMatch(/Changed\s*3/)
    expect(w.text()).toContain('against revision 4')
  })
  it('emits zoom commands', async () => {
    const w = mount(ViewerZoomControls)
    await w.get('[data-test="zoom-in"]').trigger('click')
    await w.get('[data-test="zoom-out"]').trigger('click')
    await w.get('[data-test="zoom-fit"]').trigger('click')
    expect(Object.keys(w.emitted())).toEqual(expect.arrayContaining(['zoom-in', 'zoom-out', 'fit']))
  })
})
