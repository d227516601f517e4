import { mount } from '@vue/test-utils'
import { describe, expect, it, vi } from 'vitest'
import { defineComponent, h } from 'vue'
import { requireChipDocument } from '#shared/schemas/chip'
import fixture from '../../fixtures/documents/t-junction-basic.json'

// happy-dom has no file URLs: the fixture is imported, and cloned for each use.
const loadDocumentFixture = (_name: string): Record<string, any> => structuredClone(fixture) as Record<string, any>

// Konva needs a real canvas; the canvas itself is checked in Chromium. Here vue-konva is replaced by plain
// nodes so the component's own logic — view, hit testing, events, panels — runs in happy-dom.
vi.mock('vue-konva', () => {
  const node = { batchDraw() {}, cache() {}, clearCache() {}, position() {} }
  const make = (name: string) =>
    defineComponent({
      name,
      props: { config: { type: Object, default: () => ({}) } },
      setup(_, { slots, expose }) {
        expose({ getNode: () => node })
        return () => h('div', { 'data-konva': name }, slots.default?.())
      },
    })
  return { Stage: make('Stage'), Layer: make('Layer'), Shape: make('Shape') }
})

const { default: ChipViewer } = await import('../../../components/viewer/ChipViewer.client.vue')
const doc = () => requireChipDocument(loadDocumentFixture('t-junction-basic.json'))
const view = { scale: 0.1, tx: 0, ty: 700 } // 10 µm per px; world (x, y) is at screen (x/10, 700 − y/10)

async function click(w: ReturnType<typeof mount>, x: number, y: number) {
  const c = w.get('[data-test="viewer-canvas"]')
  await c.trigger('pointerdown', { clientX: x, clientY: y, button: 0, pointerId: 1 })
  await c.trigger('pointerup', { clientX: x, clientY: y, button: 0, pointerId: 1 })
}

function mountViewer(props: Record<string, unknown> = {}) {
  const w = mount(ChipViewer, { props: { document: doc(), ...props } })
  ;(w.vm as unknown as { setView: (v: typeof view) => void }).setView(view)
  return w
}

describe('ChipViewer', () => {
  it('lists the layers with their depths and shows no legend without a comparison', () => {
    const w = mountViewer()
    expect(w.get('[data-test="layer-ch50"]').text()).toContain('50 µm deep')
    expect(w.find('[data-test="compare-legend"]').exists()).toBe(false)
    expect(w.get('[data-test="scale-bar"]').text()).toMatch(/µm|mm/)
  })

  it('in pin mode, a click adds a pin at the point in µm with the element under it', async () => {
    const w = mountViewer({ pinMode: true })
    await click(w, 300, 400) // world (3000, 3000): on the oil feed
    await click(w, 300, 500) // world (3000, 2000): bare chip
    expect(w.emitted('pin-add')).toEqual([[{ x: 3000, y: 3000, elementId: 'oil-feed' }], [{ x: 3000, y: 2000 }]])
    expect(w.emitted('element-select')).toBeUndefined()
  })

  it('otherwise a click selects the element; the junction wins over the channels it joins', async () => {
    const w = mountViewer()
    await click(w, 500, 400) // world (5000, 3000)
    await click(w, 300, 500)
    expect(w.emitted('element-select')).toEqual([['tj-1']])
    expect(w.emitted('pin-add')).toBeUndefined()
  })

  it('a click on a pin selects it, in pin mode too', async () => {
    const pins = [{ id: 'c-7', x: 3000, y: 3000, index: 1, resolved: false }]
    const w = mountViewer({ pins, pinMode: true })
    await click(w, 300, 400 - 16) // the pin's head sits above its point
    expect(w.emitted('pin-select')).toEqual([['c-7']])
    expect(w.emitted('pin-add')).toBeUndefined()
  })

  it('a drag pans and is not a click', async () => {
    const w = mountViewer({ pinMode: true })
    const c = w.get('[data-test="viewer-canvas"]')
    await c.trigger('pointerdown', { clientX: 300, clientY: 400, button: 0, pointerId: 1 })
    await c.trigger('pointermove', { clientX: 340, clientY: 380, pointerId: 1 })
    await c.trigger('pointerup', { clientX: 340, clientY: 380, button: 0, pointerId: 1 })
    expect(w.emitted('pin-add')).toBeUndefined()
    expect((w.vm as unknown as { view: typeof view }).view).toEqual({ scale: 0.1, tx: 40, ty: 680 })
  })

  it('zooms with the keys around the centre and fits with 0', async () => {
    const w = mountViewer()
    const c = w.get('[data-test="viewer-canvas"]')
    await c.trigger('keydown', { key: '+' })
    const vm = w.vm as unknown as { view: typeof view }
    expect(vm.view.scale).toBeCloseTo(0.15, 12)
    await c.trigger('keydown', { key: '-' })
    expect(vm.view.scale).toBeCloseTo(0.1, 12)
    await c.trigger('keydown', { key: '0' })
    expect(vm.view.scale).not.toBeCloseTo(0.1, 6)
  })

  it('shows the cursor position in µm and what is under it', async () => {
    const w = mountViewer()
    await w.get('[data-test="viewer-canvas"]').trigger('pointermove', { clientX: 500, clientY: 400, pointerId: 1 })
    expect(w.get('[data-test="cursor-readout"]').text()).toMatch(/x\s*5000 µm\s*y\s*3000 µm/)
    expect(w.get('[data-test="viewer-hover"]').text()).toBe('tj-1 · T-junction')
  })

  it('hides a layer from hit testing when it is switched off', async () => {
    const w = mountViewer()
    await w.get('[data-test="layer-ch50"] input').trigger('change')
    await click(w, 500, 400)
    expect(w.emitted('element-select')).toBeUndefined()
  })

  it('shows the compare legend with counts against the other revision', () => {
    const raw = loadDocumentFixture('t-junction-basic.json')
    raw.components[0].inletWidth = 40
    raw.channels = raw.channels.filter((c: { id: string }) => c.id !== 'drops-out')
    const w = mountViewer({ document: requireChipDocument(raw), compareWith: doc(), compareLabel: 'revision 2' })
    const legend = w.get('[data-test="compare-legend"]')
    expect(legend.text()).toContain('against revision 2')
    expect(w.get('[data-test="legend-removed"]').text()).toMatch(/1$/)
    expect(w.get('[data-test="legend-changed"]').text()).toMatch(/1$/)
  })

  it('never changes the document it was given', async () => {
    const d = doc()
    const before = JSON.stringify(d)
    const w = mount(ChipViewer, { props: { document: d, pinMode: true } })
    await click(w, 300, 400)
    expect(JSON.stringify(d)).toBe(before)
  })
})
