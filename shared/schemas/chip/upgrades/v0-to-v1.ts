/**
 * v0 → v1. Version 0 was the editor's draft format: no `units` field (lengths were already µm), a single
 * `liquids` block instead of named operating points, and ports with `diameter` instead of `punchDiameter`.
 * v1 states its units, keeps every liquid/pump setting in `operatingPoints` and names the punch explicitly.
 */
type Json = Record<string, unknown>

export function upgradeV0ToV1(doc: Json): Json {
  const { liquids, ...rest } = doc
  const ports = Array.isArray(doc.ports)
    ? doc.ports.map((p: Json) => {
        if (p === null || typeof p !== 'object' || !('diameter' in p) || 'punchDiameter' in p) return p
        const { diameter, ...others } = p
        return { ...others, punchDiameter: diameter }
      })
    : doc.ports
  const operatingPoints = Array.isArray(doc.operatingPoints) ? doc.operatingPoints : []
  const fromLiquids =
    liquids && typeof liquids === 'object' && operatingPoints.length === 0
      ? [{ id: 'op-1', name: 'Operating point 1', inlets: [], ...(liquids as Json) }]
      : []
  const all = [...operatingPoints, ...fromLiquids]
  return {
    ...rest,
    version: 1,
    units: doc.units ?? 'um',
    ports,
    operatingPoints: all,
    ...(all.length > 0 && doc.activeOperatingPoint === undefined ? { activeOperatingPoint: (all[0] as Json).id } : {}),
  }
}
