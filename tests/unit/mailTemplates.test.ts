import { describe, expect, it } from 'vitest'
import { escapeHtml, invitationMail, passwordResetMail, verdictMail } from '../../server/services/mailTemplates'

describe('mail templates', () => {
  it('escapes every interpolated value in the HTML and keeps the text plain', () => {
    const mail = invitationMail({
      labName: 'Lab <img src=x onerror=alert(1)>',
      role: 'designer',
      inviterName: 'Ada "A" O\'Neil',
      link: 'http://127.0.0.1:3000/invitations/abc',
      expiresAt: new Date('2027-01-08T10:00:00Z'),
    })
    expect(mail.subject).toBe('Ada "A" O\'Neil invited you to Lab <img src=x onerror=alert(1)> on Dropwright')
    expect(mail.text).toContain('as Designer.')
    expect(mail.text).toContain('Accept the invitation: http://127.0.0.1:3000/invitations/abc')
    expect(mail.text).toContain('expires on 2027-01-08')
    expect(mail.html).not.toContain('<img')
    expect(mail.html).toContain('Lab &lt;img src=x onerror=alert(1)&gt;')
    expect(mail.html).toContain('Ada &quot;A&quot; O&#39;Neil')
    expect(mail.html).toContain('href="http://127.0.0.1:3000/invitations/abc"')
  })

  it('never turns a non-http link into an anchor', () => {
    const mail = verdictMail({
      designName: 'D',
      revisionNumber: 1,
      reviewerName: 'R',
      verdict: 'approve',
      link: 'javascript:alert(1)',
    })
    expect(mail.subject).toBe('Approved: "D" revision 1')
    expect(mail.html).not.toContain('href=')
    expect(escapeHtml('&<>"\'')).toBe('&amp;&lt;&gt;&quot;&#39;')
  })

  it('writes the password reset mail with its link, how long it works, and the name escaped', () => {
    const mail = passwordResetMail({
      name: 'Ines <b>Varro</b>',
      link: 'http://127.0.0.1:3000/reset-password/abc',
      minutes: 60,
    })
    expect(mail.subject).toBe('Reset your Dropwright password')
    expect(mail.text).toContain('Choose a new password: http://127.0.0.1:3000/reset-password/abc')
    expect(mail.text).toContain('works once and for 60 minutes')
    expect(mail.html).toContain('Ines &lt;b&gt;Varro&lt;/b&gt;')
    expect(mail.html).toContain('href="http://127.0.0.1:3000/reset-password/abc"')
  })
})
