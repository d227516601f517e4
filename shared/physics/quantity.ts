// The one shape every forecast number takes: SI value, unit, the method that produced it, the
// citation of that method and whether the inputs lie inside the method's stated domain of validity.
export interface Method {
  /** Stable id, e.g. "garstecki-2006-squeezing". */
  readonly id: string
  /** Citation: authors, year, journal or book, equation. */
  readonly source: string
}

export interface Quantity {
  value: number
  unit: string
  method: string
  source: string
  valid: boolean
}

export interface Warning {
  code: string
  message: string
}

/** Builds a quantity; refuses a non-finite value so NaN or Infinity never reaches an answer. */
export function quantity(value: number, unit: string, method: Method, valid = true): Quantity {
  if (!Number.isFinite(value)) {
    throw new Error(
      `Internal: method "${method.id}" produced a non-finite value (${value}); report this input as a bug`,
    )
  }
  return { value, unit, method: method.id, source: method.source, valid }
}

/** Input values given by the caller carry this method. */
export const INPUT: Method = { id: 'input', source: 'given in the request' }
