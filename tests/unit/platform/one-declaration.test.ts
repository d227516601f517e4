// Each fact is declared once: junction kinds and revision statuses live in shared/utils and everything else derives
// from them (the database enum, the payload schemas, the labels). The scan fails when a copy of a list comes back.
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { describe, expect, it } from 'vitest'
import { revisionStatusEnum } from '~~/server/db/schema'
import { designListQuery } from '#shared/schemas/designs'
import { JUNCTION_KIND_LABELS, JUNCTION_KINDS, kindLabel } from '#shared/utils/junctionKinds'
import { REVISION_STATUS_LABELS, REVISION_STATUSES } from '#shared/utils/revisionStatus'
import { KIND_NAMES } from '#shared/format/fieldLabels'

const ROOT = join(__dirname, '../../..')
const SOURCES = ['shared', 'server', 'components', 'pages', 'stores', 'composables', 'geometry', 'utils']

function files(dir: string): string[] {
  return readdirSync(dir).flatMap(name => {
    const path = join(dir, name)
    if (name === 'migrations' || name === 'node_modules') return []
    return statSync(path).isDirectory() ? files(path) : /\.(ts|vue)$/.test(name) ? [path] : []
  })
}

/**
 * Files with a line that lists four or more of the values as elements of an array, a set or a union type (a quoted
 * value followed by `,`, `|`, `]` or `)`): a copy of the list. Keyed maps (`'draft': …`, typed by the declared
 * type) and comparisons are uses, not copies; the demo seed's revision histories are data.
 */
function copiesOf(values: readonly string[], declaredIn: string): string[] {
  const listed = values.map(v => new RegExp(`['"]${v}['"](?=\\s*[,|\\])])`))
  return SOURCES.flatMap(d => files(join(ROOT, d)))
    .map(f => relative(ROOT, f))
    .filter(f => f !== declaredIn && !/^server\/db\/seed/.test(f))
    .filter(f =>
      readFileSync(join(ROOT, f), 'utf8')
        .split('\n')
        .some(line => listed.filter(q => q.test(line)).length >= 4),
    )
}

describe('one declaration per fact', () => {
  it('junction kinds: the list filter and the labels derive from shared/utils/junctionKinds.ts', () => {
    expect(designListQuery.shape.kind.unwrap().options).toEqual([...JUNCTION_KINDS])
    for (const k of JUNCTION_KINDS) expect(KIND_NAMES[k]).toBe(JUNCTION_KIND_LABELS[k])
    expect(kindLabel('flow-focusing', 'inline')).toBe('flow-focusing cross')
    expect(kindLabel('t-junction', 'inline')).toBe('T-junction')
    expect(copiesOf(JUNCTION_KINDS, 'shared/utils/junctionKinds.ts')).toEqual([])
  })

  it('revision statuses: the database enum, the list filter and the labels derive from shared/utils/revisionStatus.ts', () => {
    expect(revisionStatusEnum.enumValues).toEqual([...REVISION_STATUSES])
    expect(designListQuery.shape.status.unwrap().options).toEqual([...REVISION_STATUSES])
    expect(Object.keys(REVISION_STATUS_LABELS)).toEqual([...REVISION_STATUSES])
    // The seed's history and the badge's colours name statuses one per entry, never the whole list on a line.
    expect(copiesOf(REVISION_STATUSES, 'shared/utils/revisionStatus.ts')).toEqual([])
  })
})
