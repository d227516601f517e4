// The demo scenario: invented lab, invented fabrication partner, invented people. One account per role.
import type { Role } from '../../shared/utils/roles'

export const DEMO_PASSWORD = 'drop-demo-2026'

export const DEMO_LABS = [
  { slug: 'quillmere', name: 'Quillmere Single-Cell Lab', kind: 'research' },
  { slug: 'orrin-valley', name: 'Orrin Valley Emulsions Group', kind: 'research' },
  { slug: 'brackenfold', name: 'Brackenfold Microfab', kind: 'fabrication' },
] as const

type DemoAccount = { email: string; name: string; memberships: Array<{ lab: string; role: Role }> }

export const DEMO_ACCOUNTS: DemoAccount[] = [
  {
    email: 'admin@quillmere.example',
    name: 'Ines Varga-Holm',
    memberships: [
      { lab: 'quillmere', role: 'admin' },
      { lab: 'orrin-valley', role: 'admin' },
    ],
  },
  {
    email: 'designer@quillmere.example',
    name: 'Tomas Reyvik',
    memberships: [
      { lab: 'quillmere', role: 'designer' },
      { lab: 'orrin-valley', role: 'reviewer' },
    ],
  },
  {
    email: 'reviewer@quillmere.example',
    name: 'Hanne Albrecht-Moss',
    memberships: [{ lab: 'quillmere', role: 'reviewer' }],
  },
  {
    email: 'experimenter@quillmere.example',
    name: 'Kofi Marangu',
    memberships: [{ lab: 'quillmere', role: 'experimenter' }],
  },
  {
    email: 'fabricator@brackenfold.example',
    name: 'Sela Dumont',
    memberships: [
      { lab: 'brackenfold', role: 'admin' },
      { lab: 'quillmere', role: 'fabricator' },
    ],
  },
]
