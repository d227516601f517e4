// Window keys for the editor; typing in a form field is left alone.
import { onBeforeUnmount, onMounted } from 'vue'
import { keyAction, type Command, type Tool } from './tools'

export function useEditorKeys(on: {
  tool: (t: Tool) => void
  command: (c: Command) => void
  view: (e: KeyboardEvent) => boolean
}) {
  function handler(e: KeyboardEvent) {
    const t = e.target as HTMLElement | null
    if (t && (t.tagName === 'INPUT' || t.tagName === 'TEXTAREA' || t.tagName === 'SELECT' || t.isContentEditable))
      return
    const a = keyAction(e)
    if (!a) {
      on.view(e)
      return
    }
    e.preventDefault()
    if ('tool' in a) on.tool(a.tool)
    else on.command(a.command)
  }
  onMounted(() => window.addEventListener('keydown', handler))
  onBeforeUnmount(() => window.removeEventListener('keydown', handler))
}
