// The editor's keys: one table for tools and commands, and the arrow-key nudge in µm.
import { describe, expect, it } from 'vitest'
import { keyAction, nudgeOf } from '../../../components/editor/lib/tools'

const key = (k: string, mods: Partial<Record<'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey', boolean>> = {}) => ({
  key: k,
  ctrlKey: false,
  metaKey: false,
  shiftKey: false,
  altKey: false,
  ...mods,
})

describe('editor keys', () => {
  it('letters pick tools, Ctrl/⌘ letters run commands, Delete and Esc do what they say', () => {
    expect(keyAction(key('t'))).toEqual({ tool: 'place:t-junction' })
    expect(keyAction(key('z', { ctrlKey: true }))).toEqual({ command: 'undo' })
    expect(keyAction(key('Z', { metaKey: true, shiftKey: true }))).toEqual({ command: 'redo' })
    expect(keyAction(key('a', { ctrlKey: true }))).toEqual({ command: 'select-all' })
    expect(keyAction(key('Backspace'))).toEqual({ command: 'delete' })
    expect(keyAction(key('Escape'))).toEqual({ command: 'escape' })
    expect(keyAction(key('ArrowLeft'))).toBeNull()
  })

  it('arrows nudge by one grid step, Shift by ten, 10 µm with the grid off; y points up as on the chip', () => {
    expect(nudgeOf(key('ArrowRight'), 50)).toEqual({ dx: 50, dy: 0 })
    expect(nudgeOf(key('ArrowUp', { shiftKey: true }), 50)).toEqual({ dx: 0, dy: 500 })
    expect(nudgeOf(key('ArrowDown'), 0)).toEqual({ dx: 0, dy: -10 })
    expect(nudgeOf(key('ArrowLeft', { ctrlKey: true }), 50)).toBeNull()
    expect(nudgeOf(key('x'), 50)).toBeNull()
  })
})
