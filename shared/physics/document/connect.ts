// Joins the document's connection points into network nodes. A channel end with an explicit reference
// ({ element, terminal }) is that terminal; free channel ends and terminals within COINCIDENCE_UM of each
// other are one node. Node names: a port's id, else "<component>:<terminal>", else "<channel>:start|end".

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

  /** Unions every pair of points within COINCIDENCE_UM (spatial hash on a grid of that cell size). */
  joinCoincident(): void {
    const n = this.entries.length
    this.parent = new Int32Array(n)
    for (let i = 0; i < n; i++) this.parent[i] = i
    const cell = COINCIDENCE_UM
    const grid = new Map<string, number[]>()
    const cellKey = (cx: number, cy: number) => `${cx},${cy}`
    for (let i = 0; i < n; i++) {
      const { x, y } = this.entries[i]!.position
      const cx = Math.floor(x / cell)
      const cy = Math.floor(y / cell)
      for (let dx = -1; dx <= 1; dx++)
        for (let dy = -1; dy <= 1; dy++) {
          for (const j of grid.get(cellKey(cx + dx, cy + dy)) ?? []) {
            const q = this.entries[j]!.position
            if (Math.hypot(q.x - x, q.y - y) <= COINCIDENCE_UM) this.union(i, j)
          }
        }
      const own = cellKey(cx, cy)
      const list = grid.get(own)
      if (list) list.push(i)
      else grid.set(own, [i])
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
export const terminalKey = (element: string, terminal: string, isPort: boolean): string => (isPort ? element : `${element}:${terminal}`)
