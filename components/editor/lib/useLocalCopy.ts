// The unsaved working copy kept in the browser, keyed by design, so a crash or a closed tab loses nothing.
import { onBeforeUnmount, watch, type Ref } from 'vue'
import { parseChipDocument, type ChipDocument } from '#shared/schemas/chip'

export interface LocalCopy {
  baseRevisionId: string
  savedAt: string
  doc: ChipDocument
}

export const localCopyKey = (designId: string) => `dropwright:editor:${designId}`

export function readLocalCopy(designId: string): LocalCopy | null {
  try {
    const raw = localStorage.getItem(localCopyKey(designId))
    if (!raw) return null
    const v = JSON.parse(raw) as LocalCopy
    const parsed = parseChipDocument(v.doc)
    return parsed.ok ? { ...v, doc: parsed.document } : null
  } catch {
    return null
  }
}

export function writeLocalCopy(designId: string, copy: LocalCopy) {
  try {
    localStorage.setItem(localCopyKey(designId), JSON.stringify(copy))
  } catch {
    /* storage full or off: keep editing */
  }
}

export const dropLocalCopy = (designId: string) => {
  try {
    localStorage.removeItem(localCopyKey(designId))
  } catch {
    /* ignore */
  }
}

/** Writes the working copy 400 ms after each change while it differs from what was saved; drops it once saved. */
export function useLocalCopy(
  designId: () => string,
  doc: Ref<ChipDocument | null>,
  dirty: Ref<boolean>,
  base: () => string | undefined,
  paused: Ref<boolean>,
) {
  let timer: ReturnType<typeof setTimeout> | undefined
  watch([doc, dirty], () => {
    clearTimeout(timer)
    if (paused.value) return
    if (!dirty.value) {
      dropLocalCopy(designId())
      return
    }
    timer = setTimeout(() => {
      if (doc.value && base())
        writeLocalCopy(designId(), { baseRevisionId: base()!, savedAt: new Date().toISOString(), doc: doc.value })
    }, 400)
  })
  onBeforeUnmount(() => clearTimeout(timer))
}
