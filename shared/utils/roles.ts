// Roles and what each may do — declared once. The server answers 403 with `requirePermission`,
// the UI hides what `can()` denies, and the database enum is built from ROLES.

export const ROLES = ['admin', 'designer', 'reviewer', 'experimenter', 'fabricator'] as const
export type Role = (typeof ROLES)[number]

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Lab admin',
  designer: 'Designer',
  reviewer: 'Reviewer',
  experimenter: 'Lab member',
  fabricator: 'Fabricator',
}

export const PERMISSIONS = [
  'lab:view', // see the lab's home page
  'members:view', // list the lab's members
  'members:manage', // change roles, remove members, invite
  'designs:view', // open the lab's designs and all their revisions
  'designs:edit', // create designs and save revisions
  'designs:archive', // archive or restore any of the lab's designs (everyone who edits may do it to their own)
  'review:comment', // comment on revisions
  'review:verdict', // approve or request changes
  'release:manage', // release an approved revision to fabrication
  'released:view', // open revisions released for fabrication (mask, fab sheet)
  'fabrication:report', // report order status and as-built sizes
  'measurements:record', // record measured droplet sizes
  'libraries:manage', // edit the lab's liquids, pairs and processes
  'forecast:run', // run the forecast API
] as const
export type Permission = (typeof PERMISSIONS)[number]

const everyoneInLab: Permission[] = ['lab:view', 'members:view', 'designs:view', 'released:view', 'forecast:run']

export const ROLE_PERMISSIONS: Record<Role, readonly Permission[]> = {
  admin: [
    ...everyoneInLab,
    'members:manage',
    'designs:edit',
    'designs:archive',
    'review:comment',
    'review:verdict',
    'release:manage',
    'measurements:record',
    'libraries:manage',
  ],
  designer: [...everyoneInLab, 'designs:edit', 'designs:archive', 'review:comment', 'measurements:record'],
  reviewer: [...everyoneInLab, 'review:comment', 'review:verdict'],
  experimenter: [...everyoneInLab, 'designs:edit', 'measurements:record'],
  // A fabrication partner sees released work only, and reports back on it.
  fabricator: ['lab:view', 'released:view', 'fabrication:report', 'forecast:run'],
}

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return role != null && ROLE_PERMISSIONS[role].includes(permission)
}

/** Archive or restore a design: with 'designs:archive' any of the lab's, with 'designs:edit' only one you created. */
export function canArchive(
  role: Role | null | undefined,
  userId: string | null | undefined,
  createdBy: string,
): boolean {
  return can(role, 'designs:archive') || (can(role, 'designs:edit') && userId != null && userId === createdBy)
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value)
}

export const PERMISSION_LABELS: Record<Permission, string> = {
  'lab:view': 'Open the lab',
  'members:view': 'See who is in the lab',
  'members:manage': 'Invite people, change roles, remove members',
  'designs:view': "Open the lab's designs and revisions",
  'designs:edit': 'Create designs and save revisions',
  'designs:archive': "Archive or restore any of the lab's designs",
  'review:comment': 'Comment on revisions',
  'review:verdict': 'Approve revisions or request changes',
  'release:manage': 'Release approved revisions to fabrication',
  'released:view': 'Open released revisions, masks and fab sheets',
  'fabrication:report': 'Report order status and as-built sizes',
  'measurements:record': 'Record measured droplet sizes',
  'libraries:manage': "Edit the lab's liquids and fabrication processes",
  'forecast:run': 'Run forecasts and sweeps',
}
