// The built-in library of liquids, pairs and surfactants, each value with its source.
import { listLiquids } from '#shared/physics/liquids'

export default defineEventHandler(() => listLiquids())
