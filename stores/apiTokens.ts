import { defineStore } from 'pinia'
import type { TokenCreate } from '~~/shared/schemas/tokens'
import type { ApiTokenInfo, NewApiToken } from '~~/shared/types/tokens'

/** The signed-in person's personal API tokens; `created` holds a new token until the page is left (shown once). */
export const useApiTokensStore = defineStore('apiTokens', () => {
  const { busy, problem, run } = useApiCall()
  const tokens = ref<ApiTokenInfo[]>([])
  const created = ref<NewApiToken | null>(null)

  async function load() {
    tokens.value = (await run(() => useRequestFetch()<ApiTokenInfo[]>('/api/account/tokens'))) ?? tokens.value
  }

  async function create(body: TokenCreate) {
    const made = await run(() => $fetch<NewApiToken>('/api/account/tokens', { method: 'POST', body }))
    if (made) {
      created.value = made
      const { token: _shownOnce, ...info } = made
      tokens.value = [info, ...tokens.value]
    }
    return made
  }

  async function revoke(id: string) {
    const done = await run(() => $fetch<ApiTokenInfo>(`/api/account/tokens/${id}`, { method: 'DELETE' }))
    if (done) tokens.value = tokens.value.map(t => (t.id === id ? done : t))
    if (created.value?.id === id) created.value = null
  }

  return { tokens, created, busy, problem, load, create, revoke }
})
