import { defineStore } from 'pinia'
import { invitationTokenParams, type InvitationAccept } from '~~/shared/schemas/invitations'
import type { InvitationAccepted, InvitationInfo } from '~~/shared/types/invitations'

/** The invitation behind a link, for whoever opened it (signed in or not). */
export const useInvitationLinkStore = defineStore('invitationLink', () => {
  const info = ref<InvitationInfo | null>(null)
  const problem = ref<ApiProblem | null>(null)
  const busy = ref(false)

  async function load(token: string) {
    info.value = null
    problem.value = null
    const shape = invitationTokenParams.safeParse({ token })
    if (!shape.success) {
      problem.value = { status: 404, message: shape.error.issues[0]!.message, fields: {} }
      return
    }
    try {
      info.value = await useRequestFetch()<InvitationInfo>(`/api/invitations/${token}`)
    } catch (error) {
      problem.value = toApiProblem(error)
    }
  }

  async function accept(token: string, body: InvitationAccept): Promise<InvitationAccepted | undefined> {
    busy.value = true
    problem.value = null
    try {
      return await $fetch<InvitationAccepted>(`/api/invitations/${token}/accept`, { method: 'POST', body })
    } catch (error) {
      problem.value = toApiProblem(error)
    } finally {
      busy.value = false
    }
  }

  return { info, problem, busy, load, accept }
})
