// The editor core: named actions on a chip document, history, snapping, clipboard and exchange. Pure TypeScript.
import { placeArray } from './arrays'
import { clearOutline, placeMark, setOutline } from './frame'
import { addChannel, placeComponent, placePort } from './draw'
import { setDocumentField, setField, setInlet, setOperatingPointField } from './fields'
import { duplicate, paste, remove } from './structure'
import { move, rotate } from './transform'
import { insertChannelPoint, moveChannelPoint, removeChannelPoint } from './channelPoints'
import { addLayer, addOperatingPoint, removeLayer, removeOperatingPoint, setLayerField } from './setup'

/** Every edit the editor can make, by name. */
export const actions = {
  move,
  rotate,
  duplicate,
  paste,
  delete: remove,
  setField,
  setDocumentField,
  setOperatingPointField,
  setInlet,
  addChannel,
  insertChannelPoint,
  moveChannelPoint,
  removeChannelPoint,
  placeComponent,
  placePort,
  placeArray,
  setOutline,
  clearOutline,
  placeMark,
  addLayer,
  setLayerField,
  removeLayer,
  addOperatingPoint,
  removeOperatingPoint,
}
export type ActionName = keyof typeof actions
export type ActionArgs<N extends ActionName> = Parameters<(typeof actions)[N]>[1]

export { runAction } from './validate'
export { actionLabel } from './labels'
export * from './history'
export { snapToGrid, snapDelta, snapPoint, nearestTerminal, type TerminalHit } from './snap'
export { copy, type Clip } from './structure'
export { pivotOf } from './transform'
export { findElement, SELECTABLE } from './elements'
export { PLACEABLE, type PlaceableKind } from './templates'
export { exportDocument, importDocument, exportFileName } from './exchange'
export { terminalPosition } from './attach'
export { elementsOnLayer } from './setup'
export { ARRAY_LIMIT, type ArrayKind } from './arrays'
export type { ActionResult, EditRefusal, HistoryPolicy, PointUm, ElementCollection } from './types'
