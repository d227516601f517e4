// Errors of the forecast core. Each issue names the field (a dotted path into the request) and says what to do.
export interface InputIssue {
  path: string
  message: string
}

export class ForecastInputError extends Error {
  readonly issues: InputIssue[]
  constructor(issues: InputIssue[]) {
    super(issues.map(issue => `${issue.path || '(request)'}: ${issue.message}`).join('; '))
    this.name = 'ForecastInputError'
    this.issues = issues
  }
}

/** Raised by the network solver; `nodes` lists the offending node ids, `sourceIndex` the source entry. */
export class NetworkError extends Error {
  constructor(
    readonly code: 'floating' | 'over-constrained' | 'unknown-node' | 'bad-resistance' | 'self-loop' | 'not-converged',
    message: string,
    readonly detail: { nodes?: string[]; channelIndex?: number; sourceIndex?: number } = {},
  ) {
    super(message)
    this.name = 'NetworkError'
  }
}
