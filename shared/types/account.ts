/** What a password reset link offers, for the page that opens it. */
export interface PasswordResetInfo {
  email: string
  name: string
  expiresAt: string
}

export interface PasswordChanged {
  otherSessionsEnded: number
}
export interface SignedOutEverywhere {
  sessionsEnded: number
}
export interface PasswordResetDone {
  sessionsEnded: number
}
