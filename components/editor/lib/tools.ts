// The editor's tools and keyboard shortcuts, in one table so the toolbar, the key handler and the help overlay agree.
import type { PlaceableKind } from '~~/shared/editor'

export type PortTool = 'port:continuous' | 'port:dispersed' | 'port:outlet'
export type Tool = 'select' | 'channel' | 'measure' | 'mark' | `place:${PlaceableKind}` | PortTool

export interface ToolEntry {
  tool: Tool
  label: string
  key: string
  group: 'edit' | 'parts' | 'ports' | 'frame'
}

export const TOOLS: ToolEntry[] = [
  { tool: 'select', label: 'Select and move', key: 's', group: 'edit' },
  { tool: 'channel', label: 'Draw channel', key: 'c', group: 'edit' },
  { tool: 'measure', label: 'Measure', key: 'm', group: 'edit' },
  { tool: 'place:t-junction', label: 'T-junction', key: 't', group: 'parts' },
  { tool: 'place:flow-focusing', label: 'Flow-focusing cross', key: 'f', group: 'parts' },
  { tool: 'place:step-nozzle', label: 'Step nozzle', key: 'n', group: 'parts' },
  { tool: 'place:y-junction', label: 'Y-junction', key: 'y', group: 'parts' },
  { tool: 'place:serpentine', label: 'Serpentine', key: 'w', group: 'parts' },
  { tool: 'port:continuous', label: 'Inlet, continuous phase', key: 'i', group: 'ports' },
  { tool: 'port:dispersed', label: 'Inlet, dispersed phase', key: 'd', group: 'ports' },
  { tool: 'port:outlet', label: 'Outlet', key: 'o', group: 'ports' },
  { tool: 'mark', label: 'Alignment cross', key: 'x', group: 'frame' },
]

export type Command =
  | 'array'
  | 'undo'
  | 'redo'
  | 'delete'
  | 'duplicate'
  | 'rotate'
  | 'copy'
  | 'paste'
  | 'escape'
  | 'help'
  | 'save'
  | 'select-all'

/** Commands with their keys as shown in the help overlay (Ctrl stands for ⌘ on a Mac). */
export const COMMANDS: Array<{ command: Command; label: string; keys: string }> = [
  { command: 'undo', label: 'Undo', keys: 'Ctrl Z' },
  { command: 'redo', label: 'Redo', keys: 'Ctrl Shift Z  or  Ctrl Y' },
  { command: 'rotate', label: 'Turn the selection 90° anticlockwise', keys: 'R' },
  { command: 'duplicate', label: 'Duplicate the selection', keys: 'Ctrl D' },
  { command: 'copy', label: 'Copy', keys: 'Ctrl C' },
  { command: 'paste', label: 'Paste', keys: 'Ctrl V' },
  { command: 'delete', label: 'Delete the selection', keys: 'Delete  or  Backspace' },
  { command: 'select-all', label: 'Select everything', keys: 'Ctrl A' },
  { command: 'escape', label: 'Finish a channel, cancel, or clear the selection', keys: 'Esc  or  Enter' },
  { command: 'save', label: 'Save a revision', keys: 'Ctrl S' },
  { command: 'help', label: 'This list', keys: '?' },
]

const ARROWS: Record<string, [number, number]> = {
  ArrowLeft: [-1, 0],
  ArrowRight: [1, 0],
  ArrowUp: [0, 1],
  ArrowDown: [0, -1],
}

/**
 * How far an arrow key moves the selection, µm (y up, as on the chip): one grid step, ten with Shift; 10 µm a step
 * with the grid off. Null for any other key, or with Ctrl, ⌘ or Alt held.
 */
export function nudgeOf(
  e: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey'>,
  gridPitch: number,
): { dx: number; dy: number } | null {
  const dir = ARROWS[e.key]
  if (!dir || e.ctrlKey || e.metaKey || e.altKey) return null
  const step = (gridPitch > 0 ? gridPitch : 10) * (e.shiftKey ? 10 : 1)
  return { dx: dir[0] * step, dy: dir[1] * step }
}

/** The command or tool a key press means, or null. */
export function keyAction(
  e: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey'>,
): { command: Command } | { tool: Tool } | null {
  const mod = e.ctrlKey || e.metaKey
  const k = e.key.toLowerCase()
  if (mod) {
    if (k === 'z') return { command: e.shiftKey ? 'redo' : 'undo' }
    const byKey: Record<string, Command> = {
      y: 'redo',
      d: 'duplicate',
      c: 'copy',
      v: 'paste',
      s: 'save',
      a: 'select-all',
    }
    return byKey[k] ? { command: byKey[k]! } : null
  }
  if (e.altKey) return null
  if (e.key === '?') return { command: 'help' }
  if (e.key === 'Delete' || e.key === 'Backspace') return { command: 'delete' }
  if (e.key === 'Escape' || e.key === 'Enter') return { command: 'escape' }
  if (k === 'r') return { command: 'rotate' }
  const t = TOOLS.find(x => x.key === k)
  return t ? { tool: t.tool } : null
}
