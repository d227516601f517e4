// The one way a number box in the editor keeps what is typed: the text is the box's own until it is accepted or
// replaced, so a re-render (a live forecast arriving while typing) never puts back the old number, and a refused
// value stays typed beside its message to be corrected rather than typed again. Enter commits and, when the value
// was accepted, hands the keyboard back to the drawing so its shortcuts work again.
import { nextTick, ref, watch } from 'vue'
import { typedNumber } from './fields'
import { useCanvasFocus } from './focusCanvas'

export interface NumberDraftSource {
  /** The value the document holds now. */
  value: () => number | undefined
  /** The refusal of the last commit, if any: while it stands, what was typed stays. */
  error: () => string | null | undefined
  /** A typed value: the number read from the text (NaN for "" or "abc") and the text itself. */
  commit: (value: number, text: string) => void
}

export function useNumberDraft(source: NumberDraftSource) {
  const shown = (v: number | undefined) => (v === undefined ? '' : String(v))
  const text = ref(shown(source.value()))
  const editing = ref(false)
  /** What was last sent: Enter and the change event that follows it send a value once. */
  let sent: string | null = null
  watch(source.value, v => {
    sent = null
    if (!editing.value || !source.error()) text.value = shown(v)
  })
  function commit() {
    if (text.value === sent) return
    sent = text.value
    editing.value = true
    source.commit(typedNumber(text.value), text.value)
  }
  const focusCanvas = useCanvasFocus()
  async function enter() {
    commit()
    await nextTick()
    if (!source.error()) focusCanvas()
  }
  return {
    text,
    commit,
    enter,
    focus: () => {
      editing.value = true
    },
    blur: () => {
      editing.value = false
    },
  }
}
