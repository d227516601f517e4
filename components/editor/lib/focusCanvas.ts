// After Enter in a number field of a side panel, the keyboard goes back to the drawing, so its shortcuts work
// again (R turns the selection, Delete removes it…). The workspace provides it; a field outside the editor has none.
import { inject, provide, type InjectionKey } from 'vue'

const KEY: InjectionKey<() => void> = Symbol('editor:focus-canvas')

export const provideCanvasFocus = (focus: () => void) => provide(KEY, focus)
export const useCanvasFocus = (): (() => void) => inject(KEY, () => {})
