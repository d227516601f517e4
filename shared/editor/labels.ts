// Every action in words, for the undo and redo buttons ("Undo move", "Redo set mainWidth").
import type { ActionArgs, ActionName } from './index'

const FIXED: Partial<Record<ActionName, string>> = {
  move: 'move',
  rotate: 'turn',
  duplicate: 'duplicate',
  paste: 'paste',
  delete: 'delete',
  setInlet: 'inlet setting',
  addChannel: 'draw channel',
  insertChannelPoint: 'add bend',
  moveChannelPoint: 'move channel point',
  removeChannelPoint: 'remove bend',
  placePort: 'place port',
  placeArray: 'nozzle array',
  setOutline: 'outline size',
  clearOutline: 'clear outline',
  placeMark: 'alignment cross',
  addLayer: 'add layer',
  removeLayer: 'remove layer',
  addOperatingPoint: 'new operating point',
  removeOperatingPoint: 'remove operating point',
}

export function actionLabel<N extends ActionName>(name: N, args: ActionArgs<N>): string {
  const a = args as { path?: string; kind?: string }
  if (name === 'placeComponent') return `place ${a.kind}`
  if (name === 'setDocumentField') return a.path === 'activeOperatingPoint' ? 'switch operating point' : `set ${a.path}`
  if (name === 'setField' || name === 'setOperatingPointField') return `set ${a.path}`
  if (name === 'setLayerField') return `layer ${a.path}`
  return FIXED[name] ?? name
}
