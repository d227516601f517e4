import { defineStore } from 'pinia'
import type { LabMembership, SessionData } from '~~/shared/types/session'
import { can as roleCan, type Permission } from '~~/shared/utils/roles'

/** The signed-in person, their labs and the active lab (from the address, remembered in a cookie). */
export const useSessionStore = defineStore('session', () => {
  const auth = useAuth()
  const route = useRoute()
  const lastLab = useCookie<string | null>('dw_lab', { sameSite: 'lax', maxAge: 60 * 60 * 24 * 365 })

  const data = computed(() => auth.data.value as SessionData | null | undefined)
  const user = computed(() => data.value?.user ?? null)
  const memberships = computed<LabMembership[]>(() => data.value?.memberships ?? [])
  const activeLab = computed<LabMembership | null>(() => {
    const id = route.params.labId as string | undefined
    return memberships.value.find(m => m.labId === id) ?? null
  })

  function can(permission: Permission): boolean {
    return roleCan(activeLab.value?.role, permission)
  }

  function homeLab(): LabMembership | null {
    return memberships.value.find(m => m.labId === lastLab.value) ?? memberships.value[0] ?? null
  }

  function rememberLab(labId: string) {
    lastLab.value = labId
  }

  async function signIn(email: string, password: string, redirect: string) {
    await auth.signIn({ email, password }, { callbackUrl: redirect })
  }

  async function signOut(callbackUrl = '/sign-in') {
    await auth.signOut({ callbackUrl })
  }

  return { user, memberships, activeLab, can, homeLab, rememberLab, signIn, signOut }
})
