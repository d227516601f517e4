import { defineStore } from 'pinia'
import type { LibraryEntryCreateBody, LibraryEntryUpdateBody, LibraryEntryView } from '~~/shared/schemas/libraries'
import type { LabLibraryListing, ReforecastAnswer } from '~~/shared/types/libraries'

/** The lab's own library (entries for the Libraries page; the merged listing for the editor's pickers). */
export const useLibrariesStore = defineStore('libraries', () => {
  const entries = ref<LibraryEntryView[]>([])
  const listing = ref<LabLibraryListing | null>(null)
  const listingLab = ref<string | null>(null)
  const problem = ref<ApiProblem | null>(null)
  const busy = ref(false)

  async function load(labId: string) {
    busy.value = true
    problem.value = null
    try {
      entries.value = (await useRequestFetch()<{ entries: LibraryEntryView[] }>(`/api/labs/${labId}/libraries`)).entries
    } catch (error) {
      problem.value = toApiProblem(error)
    } finally {
      busy.value = false
    }
  }

  /** Built-in plus the lab's open entries (GET /api/v1/liquids?lab=), for pickers; kept per lab. */
  async function loadListing(labId: string, force = false) {
    if (!force && listingLab.value === labId && listing.value) return listing.value
    try {
      listing.value = await useRequestFetch()<LabLibraryListing>(`/api/v1/liquids?lab=${labId}`)
      listingLab.value = labId
    } catch {
      listing.value = null // the pickers fall back to the built-in library
    }
    return listing.value
  }

  /** Saves a new or changed entry; answers the problem (field messages included) or null. */
  async function save(
    labId: string,
    body: LibraryEntryCreateBody | LibraryEntryUpdateBody,
    entryId?: string,
  ): Promise<ApiProblem | null> {
    busy.value = true
    try {
      const saved = entryId
        ? await $fetch<LibraryEntryView>(`/api/labs/${labId}/libraries/${entryId}`, { method: 'PATCH', body })
        : await $fetch<LibraryEntryView>(`/api/labs/${labId}/libraries`, { method: 'POST', body })
      entries.value = [...entries.value.filter(e => e.id !== saved.id), saved].sort(
        (a, b) => a.kind.localeCompare(b.kind) || a.name.localeCompare(b.name),
      )
      listingLab.value = null
      return null
    } catch (error) {
      return toApiProblem(error)
    } finally {
      busy.value = false
    }
  }

  async function archive(labId: string, entryId: string, archived: boolean): Promise<ApiProblem | null> {
    try {
      const saved = await $fetch<LibraryEntryView>(`/api/labs/${labId}/libraries/${entryId}/archive`, {
        method: 'POST',
        body: { archived },
      })
      entries.value = entries.value.map(e => (e.id === saved.id ? saved : e))
      listingLab.value = null
      return null
    } catch (error) {
      return toApiProblem(error)
    }
  }

  /** The revision forecast again with the lab's current library, beside the stored one. */
  async function reforecast(
    labId: string,
    revisionId: string,
  ): Promise<{ answer: ReforecastAnswer | null; problem: ApiProblem | null }> {
    try {
      return {
        answer: await $fetch<ReforecastAnswer>(`/api/labs/${labId}/revisions/${revisionId}/reforecast`),
        problem: null,
      }
    } catch (error) {
      return { answer: null, problem: toApiProblem(error) }
    }
  }

  return { entries, listing, problem, busy, load, loadListing, save, archive, reforecast }
})
