// Joins the document's connection points into network nodes. A channel end with an explicit reference
// ({ element, terminal }) is that terminal; a free channel end within COINCIDENCE_UM of another free end or of
// a terminal is one node with it (two terminals alone never join). Node names: a port's id, else
// "<component>:<terminal>", else "<channel>:start|end".

/** Two connection points closer than this (µm) are joined; a drawing-precision choice, not a physical one. */
export const COINCIDENCE_UM = 0.5

interface PointLike {
  x: number
  y: number
}

interface Entry {
  key: string
  position: PointLike
  /** 0 port, 1 component terminal, 2 free channel end: the lowest names the node. */
  rank: number
}

export class Connections {
  private readonly entries: Entry[] = []
  private readonly index = new Map<string, number>()
  private parent: Int32Array = new Int32Array(0)

  add(key: string, position: PointLike, rank: number): void {
    if (this.index.has(key)) return
    this.index.set(key, this.entries.length)
    this.entries.push({ key, position, rank })
  }

  has(key: string): boolean {
    return this.index.has(key)
  }

  /** Every point its own node. */
  keepApart(): void {
    this.parent = new Int32Array(this.entries.length)
    for (let i = 0; i < this.parent.length; i++) this.parent[i] = i
  }

  /**
   * Unions pairs within COINCIDENCE_UM (spatial hash on a grid of that cell size) when at least one of the two
   * has rank ≥ `joiningRank` (free channel ends).
   */
  joinCoincident(joiningRank: number): void {
    this.keepApart()
    const n = this.entries.length
    // Cells hash to numbers; two cells sharing a hash only cost a distance test, never a wrong join.
    const grid = new Map<number, number[]>()
    const hash = (cx: number, cy: number) => (Math.imul(cx, 73856093) ^ Math.imul(cy, 19349663)) | 0
    for (let i = 0; i < n; i++) {
      const own = this.entries[i]!
      const { x, y } = own.position
      const cx = Math.floor(x / COINCIDENCE_UM)
      const cy = Math.floor(y / COINCIDENCE_UM)
      for (let dx = -1; dx <= 1; dx++)
        for (let dy = -1; dy <= 1; dy++) {
          const list = grid.get(hash(cx + dx, cy + dy))
          if (!list) continue
          for (const j of list) {
            const other = this.entries[j]!
            if (own.rank < joiningRank && other.rank < joiningRank) continue
            if (Math.hypot(other.position.x - x, other.position.y - y) <= COINCIDENCE_UM) this.union(i, j)
          }
        }
      const cell = hash(cx, cy)
      const list = grid.get(cell)
      if (list) list.push(i)
      else grid.set(cell, [i])
    }
  }

  /** Node name of a connection point (call after joinCoincident). */
  node(key: string): string {
    const i = this.index.get(key)
    if (i === undefined) throw new Error(`Internal: connection point "${key}" was never registered`)
    return this.entries[this.find(i)]!.key
  }

  private find(i: number): number {
    let root = i
    while (this.parent[root] !== root) root = this.parent[root]!
    while (this.parent[i] !== root) {
      const next = this.parent[i]!
      this.parent[i] = root
      i = next
    }
    return root
  }

  private union(a: number, b: number): void {
    const ra = this.find(a)
    const rb = this.find(b)
    if (ra === rb) return
    const ea = this.entries[ra]!
    const eb = this.entries[rb]!
    // The better-ranked (then earlier) point names the merged node, so names do not depend on coordinates.
    if (ea.rank < eb.rank || (ea.rank === eb.rank && ra < rb)) this.parent[rb] = ra
    else this.parent[ra] = rb
  }
}

/** Key of a terminal: a port is its own id; a component terminal is "<id>:<terminal>". */
export const terminalKey = (element: string, terminal: string, isPort: boolean): string =>
  isPort ? element : `${element}:${terminal}`
