import { describe, expect, it } from 'vitest'
import { DEMO_PASSWORD } from '../../server/db/demo'
import { isCommonPassword, serverPasswordChecks } from '../../server/utils/password'
import { passwordChangeBody, passwordProblem, passwordResetBody } from '../../shared/schemas/auth'
import { newAccountFor } from '../../shared/schemas/invitations'
import { TEST_PASSWORD } from '../support/factory'

const owner = { email: 'ines.varro@quillmere.example', name: 'Ines Varro' }
const problem = (password: string) => passwordProblem(password, owner, serverPasswordChecks)

describe('password policy (shared/schemas/auth.ts)', () => {
  it('keeps the minimum length of 10 characters, counted in characters, not bytes', () => {
    expect(problem('short-one')).toBe('Choose a password of at least 10 characters')
    expect(problem('ünïcødé-ok')).toBeNull()
    expect(problem('x'.repeat(201))).toMatch(/at most 200/)
  })

  it('refuses one character repeated', () => {
    expect(problem('aaaaaaaaaa')).toMatch(/Do not repeat one character/)
    expect(problem('##########')).toMatch(/Do not repeat one character/)
  })

  it('refuses the e-mail, its local part and the name, whatever the case, spacing or digits added', () => {
    for (const pw of [
      'ines.varro@quillmere.example',
      'INES.VARRO@QUILLMERE.EXAMPLE',
      'ines.varro',
      'Ines Varro',
      'inesvarro2026',
      'my ines.varro@quillmere.example!',
    ]) {
      expect(problem(pw), pw).toMatch(/your e-mail address or your name/)
    }
    expect(problem('varro-ines-pipettes')).toBeNull()
  })

  it('refuses passwords on the shipped common-password list (@zxcvbn-ts/language-common), on the server', () => {
    for (const pw of ['password123', '1234567890', 'qwertyuiop', 'Password123', 'iloveyou123']) {
      expect(isCommonPassword(pw), pw).toBe(true)
      expect(problem(pw), pw).toMatch(/lists of common and leaked passwords/)
    }
    // Without the server's list (the browser), the rest of the policy still applies.
    expect(passwordProblem('password123', owner)).toBeNull()
  })

  it('lets the demo and test passwords through', () => {
    expect(
      passwordProblem(
        DEMO_PASSWORD,
        { email: 'designer@quillmere.example', name: 'Dana Designer' },
        serverPasswordChecks,
      ),
    ).toBeNull()
    expect(
      passwordProblem(
        TEST_PASSWORD,
        { email: 'designer-0-1a2b3c4d@test.example', name: 'designer 0 1a2b3c4d' },
        serverPasswordChecks,
      ),
    ).toBeNull()
  })

  it('is the rule of every form that sets a password: new account, change, reset', () => {
    const account = newAccountFor(owner.email, serverPasswordChecks).safeParse({
      name: 'Ines Varro',
      password: 'inesvarro1',
    })
    expect(account.error?.issues).toEqual([
      expect.objectContaining({
        path: ['password'],
        message: expect.stringMatching(/your e-mail address or your name/),
      }),
    ])
    expect(
      newAccountFor(owner.email).safeParse({ name: 'Ines Varro', password: 'aaaaaaaaaa' }).error?.issues[0]?.message,
    ).toMatch(/Do not repeat/)

    const change = passwordChangeBody(owner, serverPasswordChecks).safeParse({
      currentPassword: 'old-password-1',
      newPassword: 'qwertyuiop',
    })
    expect(change.error?.issues[0]).toMatchObject({
      path: ['newPassword'],
      message: expect.stringMatching(/common and leaked/),
    })
    const same = passwordChangeBody(owner).safeParse({
      currentPassword: 'river-glass-lantern',
      newPassword: 'river-glass-lantern',
    })
    expect(same.error?.issues[0]).toMatchObject({
      path: ['newPassword'],
      message: expect.stringMatching(/differs from the current one/),
    })

    const reset = passwordResetBody(owner, serverPasswordChecks).safeParse({ password: 'short' })
    expect(reset.error?.issues[0]).toMatchObject({
      path: ['password'],
      message: 'Choose a password of at least 10 characters',
    })
    expect(passwordResetBody(owner, serverPasswordChecks).parse({ password: 'river-glass-lantern' }).password).toBe(
      'river-glass-lantern',
    )
  })
})
