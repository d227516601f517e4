// The chip document: one versioned JSON format shared by the editor, the server, the forecast and the DXF export.
export { chipDocument } from './document'
export type { ChipDocument, ChipDocumentInput } from './document'
export { CHIP_DOCUMENT_VERSION, chipDocumentShape } from './document-shape'
export { parseChipDocument, requireChipDocument, ChipDocumentInvalid } from './parse'
export { parseEditedDocument, rememberParsed } from './incremental'
export type { ParseChipDocumentResult } from './parse'
export type { ChipDocumentError } from './errors'
export { upgradeChipDocument, upgradeSteps } from './upgrades'
export { componentTerminals, portTerminals, terminalNames } from './terminals'
export type { Terminal, TerminalRole } from './terminals'
export { toWorld, rotateDirection } from './transform'
export { component, componentLayerIds, serpentineRunLength, stepArrayLength } from './components'
export type {
  Component,
  ComponentKind,
  TJunction,
  FlowFocusing,
  StepNozzle,
  StepArray,
  YJunction,
  Serpentine,
} from './components'
export { layer } from './layers'
export type { Layer } from './layers'
export { port, phase } from './ports'
export type { Port, Phase } from './ports'
export { channel } from './channels'
export type { Channel } from './channels'
export { outline } from './outline'
export type { Outline } from './outline'
export { mark } from './marks'
export type { Mark } from './marks'
export { operatingPoint, inletSetting, liquidRef } from './operating-points'
export type { OperatingPoint, InletSetting, LiquidRef } from './operating-points'
export { point, elementId, terminalRef } from './primitives'
export type { Point, TerminalRef } from './primitives'
export { um } from './units'
export type { Micrometres, Degrees } from './units'
export { CHIP_LIMITS, shownLimit } from './limits'
export { documentPieceCount, LARGE_CHIP_PIECES } from './totals'
