// What the person does in the editor, each a named action of the editor store, with the commands and the keys
// that reach them: the canvas and panel events (`on`), the toolbar and keyboard commands (`command`), and the arrow
// keys (a nudge of the selection, else a pan). The workspace only lays things out and wires these in.
import type { Ref } from 'vue'
import type { InletSetting, TerminalRef } from '#shared/schemas/chip'
import type { ArrayKind, PlaceableKind, PointUm } from '#shared/editor'
import { nudgeOf, type Command, type Tool } from './tools'
import { useEditorKeys } from './useEditorKeys'
import type { useEditorStore } from '~/stores/editor'

type EditorStore = ReturnType<typeof useEditorStore>

/** What the actions need of the canvas component. */
export interface CanvasHandle {
  fit: () => void
  escape: () => boolean
  onViewKey: (e: KeyboardEvent) => boolean
}

export interface EditorUi {
  tool: Ref<Tool>
  channelWidth: Ref<number>
  help: Ref<boolean>
  arrayForm: Ref<boolean>
  canvas: () => CanvasHandle | null | undefined
}

export function useEditorActions(store: EditorStore, ui: EditorUi) {
  const layer = () => store.drawLayer || store.doc!.layers[0]!.id
  /** A creating action selects what it made and goes back to the select tool. */
  const created = (f: (ids: string[]) => boolean) => {
    const ids: string[] = []
    if (f(ids)) {
      store.select(ids)
      ui.tool.value = 'select'
    }
  }
  const on = {
    move: (ids: string[], dx: number, dy: number) => store.apply('move', { ids, dx, dy }),
    channel: (points: PointUm[], start?: TerminalRef, end?: TerminalRef) =>
      created(ids =>
        store.apply('addChannel', { points, width: ui.channelWidth.value, layerId: layer(), start, end, created: ids }),
      ),
    place: (kind: PlaceableKind, at: PointUm) =>
      created(ids => store.apply('placeComponent', { kind, position: at, layerId: layer(), created: ids })),
    port: (kind: 'inlet' | 'outlet', phase: 'continuous' | 'dispersed' | undefined, at: PointUm) =>
      created(ids => store.apply('placePort', { kind, phase, position: at, layerId: layer(), created: ids })),
    set: (id: string, path: string, value: unknown) => store.apply('setField', { id, path, value }),
    mark: (at: PointUm) => created(ids => store.apply('placeMark', { position: at, created: ids })),
    outline: (change: { width?: number; height?: number; corner?: PointUm }) => store.apply('setOutline', change),
    clearOutline: () => store.apply('clearOutline', {}),
    opField: (opId: string, path: string, value: unknown) =>
      store.apply('setOperatingPointField', { opId, path, value }),
    inlet: (opId: string, setting: InletSetting) => store.apply('setInlet', { opId, setting }),
    active: (opId: string) => store.apply('setDocumentField', { path: 'activeOperatingPoint', value: opId }),
    addOp: (from: string) => store.apply('addOperatingPoint', { from }),
    removeOp: (id: string) => store.apply('removeOperatingPoint', { id }),
    addLayer: (depth: number) => {
      const ids: string[] = []
      if (store.apply('addLayer', { depth, created: ids })) store.drawLayer = ids[0]!
    },
    setLayer: (id: string, path: 'name' | 'depth', value: string | number) =>
      store.apply('setLayerField', { id, path, value }),
    removeLayer: (id: string) => store.apply('removeLayer', { id }),
    bend: (id: string, point: PointUm) => {
      store.apply('insertChannelPoint', { id, point })
      store.select([id])
    },
    vertex: (id: string, index: number, point: PointUm, attach?: TerminalRef) =>
      store.apply('moveChannelPoint', { id, index, point, attach }),
    unbend: (id: string, index: number) => store.apply('removeChannelPoint', { id, index }),
    array: (args: { kind: ArrayKind; count: number; pitch: number; mode: 'replace' | 'add' }) => {
      const ids: string[] = []
      if (store.apply('placeArray', { ...args, created: ids })) {
        ui.arrayForm.value = false
        store.select(ids)
        requestAnimationFrame(() => ui.canvas()?.fit())
      }
    },
  }

  const acts: Record<Command, () => void> = {
    array: () => (ui.arrayForm.value = !ui.arrayForm.value),
    undo: () => store.undo(),
    redo: () => store.redo(),
    delete: () => store.deleteSelection(),
    duplicate: () => store.duplicateSelection(),
    rotate: () => store.rotateSelection(90),
    copy: () => store.copySelection(),
    paste: () => store.pasteClip(),
    help: () => (ui.help.value = !ui.help.value),
    save: () => document.querySelector<HTMLTextAreaElement>('[data-test=save-message]')?.focus(),
    'select-all': () =>
      store.doc &&
      store.select(
        [...store.doc.components, ...store.doc.ports, ...store.doc.channels, ...store.doc.marks].map(e => e.id),
      ),
    escape: () => {
      if (ui.help.value) ui.help.value = false
      else if (!ui.canvas()?.escape()) store.select([])
    },
  }
  const command = (c: Command) => acts[c]()

  /** Arrow keys move the selection (one undo step each); with nothing selected they pan. */
  function viewKey(e: KeyboardEvent): boolean {
    const n = store.selection.length ? nudgeOf(e, store.gridPitch) : null
    if (n) {
      e.preventDefault()
      store.apply('move', { ids: store.selection, dx: n.dx, dy: n.dy })
      return true
    }
    return ui.canvas()?.onViewKey(e) ?? false
  }
  useEditorKeys({ tool: t => (ui.tool.value = t), command, view: viewKey })

  return { on, command }
}
