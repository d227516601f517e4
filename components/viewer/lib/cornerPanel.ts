// The panel floating over a chip canvas's top-left corner (the layer toggles, the compare legend): its right and
// bottom edges inside the frame, for Fit to keep the chip clear of it, and a call when it changes size (opened,
// closed, a legend added) so a view that follows Fit fits again.
import type { Ref } from 'vue'
import { useResizeObserver } from '@vueuse/core'

export function useCornerPanel(panel: Ref<HTMLElement | null>, changed: () => void) {
  useResizeObserver(panel, changed)
  return (): { width: number; height: number } | null => {
    const el = panel.value
    if (!el || !el.offsetWidth || !el.offsetHeight) return null
    return { width: el.offsetLeft + el.offsetWidth, height: el.offsetTop + el.offsetHeight }
  }
}
