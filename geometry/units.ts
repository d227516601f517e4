import type { Pair } from './types'

/**
 * Database unit of the geometry engine: 1 nm. Documents are in µm (floating point); union, offsetting and the
 * sizing rule checks run on integer coordinates in this unit, as mask tools do (GDSII and OASIS layouts store
 * integer multiples of a database unit, commonly 1 nm), so every boolean result is exact and robust on its grid.
 * The document's ±200 000 µm coordinate limit is ±2e11 nm, far inside Clipper2's ±4.6e18 range.
 */
export const DATABASE_UNIT_NM = 1
/** Database units per µm (1000 for a 1 nm unit). */
export const DBU_PER_UM = 1000 / DATABASE_UNIT_NM

/** µm → nearest database unit. */
export const toDbu = (um: number): number => Math.round(um * DBU_PER_UM)
/** Database units → µm. */
export const fromDbu = (dbu: number): number => dbu / DBU_PER_UM
/** A µm point on the database grid (still in µm). */
export const snapPair = ([x, y]: Pair): Pair => [fromDbu(toDbu(x)), fromDbu(toDbu(y))]
