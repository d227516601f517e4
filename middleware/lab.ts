// Pages under /labs/:labId render only for members of that lab; the server checks again on every request.
export default defineNuxtRouteMiddleware((to) => {
  const session = useSessionStore()
  const labId = to.params.labId as string
  if (!session.memberships.some(m => m.labId === labId)) {
    return abortNavigation(createError({ statusCode: 404, statusMessage: 'No such lab', fatal: true }))
  }
  session.rememberLab(labId)
})
