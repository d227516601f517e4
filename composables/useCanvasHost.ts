// The element that hosts a chip canvas (viewer and editor): its size, the wheel and a redraw once the shipped fonts
// have loaded. Nuxt renders a `.client` component's template only after it has mounted, so its template refs are
// still empty inside onMounted on a full page load; everything here follows the element ref instead (vueuse attaches
// when the element appears and detaches when it goes), so the canvas always knows its real size.
import type { Ref } from 'vue'
import { useEventListener, useResizeObserver } from '@vueuse/core'
import { watch } from 'vue'

export interface CanvasHostHooks {
  /** The frame's content box in CSS pixels, on first layout and on every change. */
  resize: (width: number, height: number) => void
  /** Wheel events, attached non-passive so they can zoom instead of scrolling the page. */
  wheel: (e: WheelEvent) => void
  /** Called once the frame exists and again when the web fonts are ready (labels are measured with them). */
  redraw: () => void
}

export function useCanvasHost(frame: Ref<HTMLElement | null>, hooks: CanvasHostHooks) {
  const measure = (el: HTMLElement) => hooks.resize(el.clientWidth, el.clientHeight)
  useResizeObserver(frame, () => {
    if (frame.value) measure(frame.value)
  })
  useEventListener(frame, 'wheel', hooks.wheel, { passive: false })
  watch(
    frame,
    el => {
      if (!el) return
      measure(el)
      document.fonts?.ready.then(hooks.redraw)
    },
    { immediate: true, flush: 'post' },
  )
}
