import { describe, expect, it } from 'vitest'
import { can, canArchive, isRole, PERMISSIONS, ROLES, type Permission, type Role } from '../../shared/utils/roles'

// The whole role matrix, case by case: the product brief's table of who gets what done.
const MATRIX: Record<Permission, Role[]> = {
  'lab:view': ['admin', 'designer', 'reviewer', 'experimenter', 'fabricator'],
  'members:view': ['admin', 'designer', 'reviewer', 'experimenter'],
  'members:manage': ['admin'],
  'designs:view': ['admin', 'designer', 'reviewer', 'experimenter'],
  'designs:edit': ['admin', 'designer', 'experimenter'],
  'designs:archive': ['admin', 'designer'],
  'review:comment': ['admin', 'designer', 'reviewer'],
  'review:verdict': ['admin', 'reviewer'],
  'release:manage': ['admin'],
  'released:view': ['admin', 'designer', 'reviewer', 'experimenter', 'fabricator'],
  'fabrication:report': ['fabricator'],
  'measurements:record': ['admin', 'designer', 'experimenter'],
  'libraries:manage': ['admin'],
  'forecast:run': ['admin', 'designer', 'reviewer', 'experimenter', 'fabricator'],
}

describe('role permissions', () => {
  it('lists every permission in the matrix', () => {
    expect(Object.keys(MATRIX).sort()).toEqual([...PERMISSIONS].sort())
  })
  for (const permission of PERMISSIONS) {
    for (const role of ROLES) {
      const expected = MATRIX[permission].includes(role)
      it(`${role} ${expected ? 'may' : 'may not'} ${permission}`, () => {
        expect(can(role, permission)).toBe(expected)
      })
    }
  }
  it('lets an experimenter archive only designs they created, and nobody without designs:edit', () => {
    expect(canArchive('experimenter', 'u1', 'u1')).toBe(true)
    expect(canArchive('experimenter', 'u1', 'u2')).toBe(false)
    expect(canArchive('designer', 'u1', 'u2')).toBe(true)
    expect(canArchive('admin', 'u1', 'u2')).toBe(true)
    expect(canArchive('reviewer', 'u1', 'u1')).toBe(false)
    expect(canArchive('fabricator', 'u1', 'u1')).toBe(false)
    expect(canArchive('experimenter', null, 'u1')).toBe(false)
  })
  it('denies everything without a role', () => {
    expect(PERMISSIONS.some(p => can(null, p))).toBe(false)
  })
  it('recognises only declared roles', () => {
    expect(isRole('designer')).toBe(true)
    expect(isRole('owner')).toBe(false)
  })
})
