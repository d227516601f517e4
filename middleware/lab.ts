// Remembers the lab a member opens. Pages render through <LabGate>, which shows "not found" to non-members;
// the server checks membership again on every API request.
export default defineNuxtRouteMiddleware(to => {
  const session = useSessionStore()
  const labId = to.params.labId as string
  if (session.memberships.some(m => m.labId === labId)) session.rememberLab(labId)
})
