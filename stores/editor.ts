import { defineStore } from 'pinia'
import { computed, ref, shallowRef } from 'vue'
import { parseChipDocument, rememberParsed, type ChipDocument } from '~~/shared/schemas/chip'
import {
  actionLabel,
  actions,
  canRedo,
  canUndo,
  commit,
  copy,
  redo as redoH,
  redoLabel,
  runAction,
  undoLabel,
  startHistory,
  undo as undoH,
  type ActionArgs,
  type ActionName,
  type Clip,
  type History,
} from '~~/shared/editor'
import type { RevisionDetail, RevisionRow } from '~~/shared/types/designs'

export interface SaveConflict {
  message: string
  latestRevisionId: string
  since: RevisionRow[]
}

/** The chip being edited: working document, history, selection, and saving it as a revision. */
export const useEditorStore = defineStore('editor', () => {
  const labId = ref('')
  const designId = ref('')
  const designName = ref('')
  /** The design's fabrication process (rule checks use it), from the opened revision's summary. */
  const processId = ref<string | null>(null)
  /** The revision edits are based on: the one opened, then the one last saved. */
  const base = ref<{ id: string; number: number } | null>(null)
  const history = shallowRef<History | null>(null)
  const saved = shallowRef<ChipDocument | null>(null)
  const selection = ref<string[]>([])
  const gridPitch = ref(50)
  /** The layer new channels, parts and ports are drawn on (the first layer until the person picks another). */
  const drawLayer = ref('')
  const refusal = ref<string | null>(null)
  const conflict = ref<SaveConflict | null>(null)
  const clip = shallowRef<Clip | null>(null)
  const { busy, problem, run } = useApiCall()

  const doc = computed(() => history.value?.present ?? null)
  const dirty = computed(() => !!doc.value && doc.value !== saved.value)
  const undoable = computed(() => !!history.value && canUndo(history.value))
  const redoable = computed(() => !!history.value && canRedo(history.value))
  /** What undo and redo would do, in words, for the buttons' titles. */
  const undoing = computed(() => (history.value ? undoLabel(history.value) : null))
  const redoing = computed(() => (history.value ? redoLabel(history.value) : null))

  function open(revision: RevisionDetail, document: ChipDocument) {
    labId.value = revision.labId
    designName.value = revision.designName
    processId.value = revision.summary?.processId ?? null
    base.value = { id: revision.id, number: revision.number }
    rememberParsed(document)
    history.value = startHistory(document)
    saved.value = document
    selection.value = []
    drawLayer.value = document.layers[0]!.id
    refusal.value = null
    conflict.value = null
  }

  async function load(lab: string, design: string, fromRevisionId?: string) {
    designId.value = design
    const api = useRequestFetch()
    await run(async () => {
      let revisionId = fromRevisionId
      if (!revisionId) {
        const d = await api<{ design: { latestRevisionId: string | null } }>(`/api/labs/${lab}/designs/${design}`)
        revisionId = d.design.latestRevisionId ?? undefined
      }
      if (!revisionId) throw createError({ statusCode: 404, message: 'This design has no revision to edit yet' })
      const r = await api<RevisionDetail & { designId?: string }>(`/api/labs/${lab}/revisions/${revisionId}`)
      const parsed = parseChipDocument(r.document)
      if (!parsed.ok)
        throw createError({
          statusCode: 422,
          message: `This revision's document does not open: ${parsed.errors[0]!.message}`,
        })
      open(r, parsed.document)
    })
  }

  /** Apply a named action; an invalid result is refused with the schema's message and nothing changes. */
  function apply<N extends ActionName>(name: N, args: ActionArgs<N>): boolean {
    if (!history.value) return false
    const result = runAction(
      history.value.present,
      actions[name] as (d: ChipDocument, a: ActionArgs<N>) => ReturnType<typeof actions.move>,
      args,
    )
    if (!result.ok) {
      refusal.value = result.refusal.message
      return false
    }
    refusal.value = null
    history.value = commit(history.value, result.doc, result.history, actionLabel(name, args))
    selection.value = selection.value.filter(id => elementExists(result.doc, id))
    keepDrawLayer()
    return true
  }

  /**
   * On the client, after the page came from the server: check the working document once and, when it reads back
   * unchanged, remember its parts as valid, so each edit re-checks only what it changed.
   */
  function adoptHydrated() {
    const d = doc.value
    if (!d) return
    const r = parseChipDocument(d)
    if (r.ok && JSON.stringify(r.document) === JSON.stringify(d)) rememberParsed(d)
  }

  /** Replace the whole working document (import, restore of a local copy): one undo step. */
  function replace(document: ChipDocument) {
    if (history.value) history.value = commit(history.value, document, 'record', 'import')
    selection.value = []
    keepDrawLayer()
  }

  const undo = () => {
    if (history.value) {
      history.value = undoH(history.value)
      prune()
    }
  }
  const redo = () => {
    if (history.value) {
      history.value = redoH(history.value)
      prune()
    }
  }
  const prune = () => {
    selection.value = selection.value.filter(id => doc.value && elementExists(doc.value, id))
    keepDrawLayer()
  }
  const keepDrawLayer = () => {
    if (doc.value && !doc.value.layers.some(l => l.id === drawLayer.value)) drawLayer.value = doc.value.layers[0]!.id
  }

  function select(ids: string[], mode: 'replace' | 'toggle' | 'add' = 'replace') {
    if (mode === 'replace') selection.value = [...ids]
    else if (mode === 'add') selection.value = [...new Set([...selection.value, ...ids])]
    else
      for (const id of ids)
        selection.value = selection.value.includes(id)
          ? selection.value.filter(s => s !== id)
          : [...selection.value, id]
  }

  const offset = () => ({
    x: gridPitch.value > 0 ? 4 * gridPitch.value : 200,
    y: -(gridPitch.value > 0 ? 4 * gridPitch.value : 200),
  })
  function copySelection() {
    if (doc.value && selection.value.length) clip.value = copy(doc.value, selection.value)
  }
  function pasteClip() {
    if (!clip.value) return
    const inserted: string[] = []
    if (apply('paste', { clip: clip.value, offset: offset(), inserted })) selection.value = inserted
  }
  function duplicateSelection() {
    const inserted: string[] = []
    if (selection.value.length && apply('duplicate', { ids: selection.value, offset: offset(), inserted }))
      selection.value = inserted
  }
  function deleteSelection() {
    if (selection.value.length && apply('delete', { ids: selection.value })) selection.value = []
  }
  function rotateSelection(deg = 90) {
    if (selection.value.length) apply('rotate', { ids: selection.value, deg })
  }

  /** Save the working document as a new revision whose parent is the one edits are based on. */
  async function save(message: string, branch = false) {
    if (!doc.value || !base.value) return false
    conflict.value = null
    const document = doc.value
    const url = `/api/labs/${labId.value}/designs/${designId.value}/revisions`
    try {
      busy.value = true
      problem.value = null
      const r = await $fetch<{ revisionId: string; number: number }>(url, {
        method: 'POST',
        body: { parentId: base.value.id, message, document, branch },
      })
      base.value = { id: r.revisionId, number: r.number }
      saved.value = document
      return true
    } catch (error) {
      const e = error as {
        statusCode?: number
        data?: { message?: string; data?: { latestRevisionId: string; since: RevisionRow[] } }
      }
      if (e.statusCode === 409 && e.data?.data?.latestRevisionId)
        conflict.value = { message: e.data.message ?? 'A newer revision was saved first', ...e.data.data }
      else problem.value = toApiProblem(error)
      return false
    } finally {
      busy.value = false
    }
  }

  return {
    labId,
    designId,
    designName,
    processId,
    base,
    history,
    doc,
    saved,
    selection,
    gridPitch,
    drawLayer,
    refusal,
    conflict,
    busy,
    problem,
    dirty,
    undoable,
    redoable,
    undoing,
    redoing,
    load,
    open,
    adoptHydrated,
    apply,
    replace,
    undo,
    redo,
    select,
    copySelection,
    pasteClip,
    duplicateSelection,
    deleteSelection,
    rotateSelection,
    save,
    hasClip: computed(() => !!clip.value),
  }
})

function elementExists(d: ChipDocument, id: string) {
  return (
    d.components.some(c => c.id === id) ||
    d.ports.some(p => p.id === id) ||
    d.channels.some(c => c.id === id) ||
    d.marks.some(m => m.id === id)
  )
}
