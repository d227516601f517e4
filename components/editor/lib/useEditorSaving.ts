// Saving and what keeps the work safe around it: the save itself ("Saved as r4"), the copy kept in this browser
// (offered back when the page opens with edits that were never saved), reloading the latest revision after a
// conflict without losing the edits, the warning before leaving with unsaved changes, and JSON export/import.
import { onBeforeUnmount, onMounted, ref, toRef } from 'vue'
import { exportDocument, exportFileName, importDocument } from '#shared/editor'
import { dropLocalCopy, readLocalCopy, useLocalCopy, writeLocalCopy, type LocalCopy } from './useLocalCopy'
import type { useEditorStore } from '~/stores/editor'

export function useEditorSaving(store: ReturnType<typeof useEditorStore>) {
  const restore = ref<LocalCopy | null>(null)
  const paused = ref(false)
  useLocalCopy(
    () => store.designId,
    toRef(store, 'doc'),
    toRef(store, 'dirty'),
    () => store.base?.id,
    paused,
  )

  /** The revision number of the last save in this visit; the save bar clears its message on it. */
  const savedAs = ref<number | null>(null)
  async function save(message: string, branch = false) {
    if (await store.save(message, branch)) {
      dropLocalCopy(store.designId)
      savedAs.value = store.base?.number ?? null
    }
  }
  async function reloadLatest() {
    if (store.doc && store.base)
      writeLocalCopy(store.designId, {
        baseRevisionId: store.base.id,
        savedAt: new Date().toISOString(),
        doc: store.doc,
      })
    paused.value = true
    savedAs.value = null
    const kept = readLocalCopy(store.designId)
    await store.load(store.labId, store.designId)
    restore.value = kept
    paused.value = false
  }
  function takeRestore() {
    if (restore.value) store.replace(restore.value.doc)
    restore.value = null
  }
  function dropRestore() {
    dropLocalCopy(store.designId)
    restore.value = null
  }

  function exportJson() {
    if (!store.doc) return
    const a = document.createElement('a')
    a.href = URL.createObjectURL(new Blob([exportDocument(store.doc)], { type: 'application/json' }))
    a.download = exportFileName(store.doc)
    a.click()
    URL.revokeObjectURL(a.href)
  }
  const importError = ref<string | null>(null)
  async function importJson(e: Event) {
    const file = (e.target as HTMLInputElement).files?.[0]
    if (!file) return
    const r = importDocument(await file.text())
    importError.value = r.ok ? null : r.message
    if (r.ok) store.replace(r.doc)
    ;(e.target as HTMLInputElement).value = ''
  }

  const unload = (e: BeforeUnloadEvent) => {
    if (store.dirty) {
      e.preventDefault()
      e.returnValue = ''
    }
  }
  onMounted(() => {
    window.addEventListener('beforeunload', unload)
    const kept = readLocalCopy(store.designId)
    if (kept && store.doc && JSON.stringify(kept.doc) !== JSON.stringify(store.doc)) restore.value = kept
  })
  onBeforeUnmount(() => window.removeEventListener('beforeunload', unload))

  return { save, savedAs, reloadLatest, restore, takeRestore, dropRestore, exportJson, importJson, importError }
}
