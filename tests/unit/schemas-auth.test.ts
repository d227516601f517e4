import { describe, expect, it } from 'vitest'
import { signInBody } from '../../shared/schemas/auth'
import { memberRoleUpdate } from '../../shared/schemas/labs'

describe('sign-in body', () => {
  it('normalises the e-mail', () => {
    expect(signInBody.parse({ email: '  Designer@Quillmere.Example ', password: 'x' }).email).toBe(
      'designer@quillmere.example',
    )
  })
  it('names each bad field', () => {
    const r = signInBody.safeParse({ email: 'not-an-address', password: '' })
    expect(r.success).toBe(false)
    expect(r.error!.issues.map(i => i.path[0]).sort()).toEqual(['email', 'password'])
  })
  it('rejects an over-long e-mail', () => {
    expect(signInBody.safeParse({ email: `${'a'.repeat(250)}@x.example`, password: 'p' }).success).toBe(false)
  })
  it('accepts only declared roles', () => {
    expect(memberRoleUpdate.safeParse({ role: 'owner' }).success).toBe(false)
    expect(memberRoleUpdate.parse({ role: 'reviewer' }).role).toBe('reviewer')
  })
})
