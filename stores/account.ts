import { defineStore } from 'pinia'
import { passwordResetParams, type PasswordChange } from '~~/shared/schemas/auth'
import type {
  PasswordChanged,
  PasswordResetDone,
  PasswordResetInfo,
  SignedOutEverywhere,
} from '~~/shared/types/account'

/** The signed-in person's own account (password, sessions), and the password reset flow for anyone. */
export const useAccountStore = defineStore('account', () => {
  const { busy, problem, run } = useApiCall()
  const resetInfo = ref<PasswordResetInfo | null>(null)

  const changePassword = (body: PasswordChange) =>
    run(() => $fetch<PasswordChanged>('/api/auth/password', { method: 'POST', body }))

  const signOutEverywhere = () =>
    run(() => $fetch<SignedOutEverywhere>('/api/auth/logout-everywhere', { method: 'POST' }))

  /** Always answers the same sentence, whether or not an account has the address. */
  const requestReset = (email: string) =>
    run(
      async () =>
        (await $fetch<{ message: string }>('/api/auth/password-reset', { method: 'POST', body: { email } })).message,
    )

  async function loadReset(token: string) {
    resetInfo.value = null
    const shape = passwordResetParams.safeParse({ token })
    if (!shape.success) {
      problem.value = { status: 404, message: shape.error.issues[0]!.message, fields: {} }
      return
    }
    resetInfo.value = (await run(() => $fetch<PasswordResetInfo>(`/api/auth/password-reset/${token}`))) ?? null
  }

  const reset = (token: string, password: string) =>
    run(() => $fetch<PasswordResetDone>(`/api/auth/password-reset/${token}`, { method: 'POST', body: { password } }))

  const clearProblem = () => {
    problem.value = null
  }

  return { busy, problem, resetInfo, changePassword, signOutEverywhere, requestReset, loadReset, reset, clearProblem }
})
