// Busy flag and mapped problem for a store's API calls, so each store maps errors the same way.
export function useApiCall() {
  const busy = ref(false)
  const problem = ref<ApiProblem | null>(null)
  async function run<T>(work: () => Promise<T>): Promise<T | undefined> {
    busy.value = true
    problem.value = null
    try {
      return await work()
    } catch (error) {
      problem.value = toApiProblem(error)
      return undefined
    } finally {
      busy.value = false
    }
  }
  return { busy, problem, run }
}
