import { describe, expect, it } from 'vitest'
import { effectScope, nextTick, ref } from 'vue'
import { parseChipDocument, type ChipDocument } from '../../../shared/schemas/chip'
import { designProcess, useLiveForecast } from '../../../components/editor/lib/liveForecast'
import { fixtureDocument } from '../../support/factory'

const doc = (): ChipDocument => { const r = parseChipDocument(fixtureDocument()); if (!r.ok) throw new Error('fixture'); return r.document }
/** The fixture with the outlet channel 10 µm wide: under the film-mask minimum feature (20 µm), over the chrome-mask one (3 µm). */
const narrow = (): ChipDocument => { const d = doc(); return { ...d, channels: d.channels.map(c => (c.id === 'drops-out' ? { ...c, width: 10 } : c)) } }
const wait = (ms: number) => new Promise(r => setTimeout(r, ms))

describe('live design-rule findings', () => {
  it('use the process the design names, the first built-in one only when it names none we know', () => {
    expect(designProcess('chrome-mask-soft-litho').id).toBe('chrome-mask-soft-litho')
    expect(designProcess('film-mask-soft-litho').id).toBe('film-mask-soft-litho')
    expect(designProcess('no-such-process').id).toBe('film-mask-soft-litho')
    expect(designProcess(null).id).toBe('film-mask-soft-litho')
  })

  it('a 10 µm channel is a finding on a film mask and none on a chrome mask, and follows a change of process', async () => {
    const processId = ref<string | null>('film-mask-soft-litho')
    const scope = effectScope()
    const { findings } = scope.run(() => useLiveForecast(ref(narrow()), { processId }))!
    await wait(200)
    const about = () => findings.value.filter(f => f.elements.includes('drops-out') && /minimum|feature|narrow/i.test(`${f.rule} ${f.message}`))
    expect(about().length).toBeGreaterThan(0)
    processId.value = 'chrome-mask-soft-litho'
    await nextTick()
    await wait(200)
    expect(about()).toEqual([])
    scope.stop()
  })
})
