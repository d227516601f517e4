import { beforeAll, describe, expect, it } from 'vitest'
import { fixtureDocument } from '../support/factory'
import { ALL_ROLES, labWithDesign } from '../support/designs'
import { releasedOrder } from '../support/orders'
import { can, type Permission, type Role } from '../../shared/utils/roles'

// Every lab-scoped route × every role × own lab / another lab. Allowed calls must get past the access check
// (any status but 401, 403 and 404); forbidden ones get 403; another lab's ids always give 404.
type Ctx = Awaited<ReturnType<typeof labWithDesign>>
interface Route {
  name: string
  method: string
  path: (c: Ctx) => string
  permission: Permission
  body?: (c: Ctx) => unknown
  allowed?: (role: Role) => boolean
  released?: boolean
}

const ROUTES: Route[] = [
  { name: 'list members', method: 'GET', path: c => `/api/labs/${c.lab.id}/members`, permission: 'members:view' },
  {
    name: 'change a role',
    method: 'PATCH',
    path: c => `/api/labs/${c.lab.id}/members/${c.ids.experimenter}`,
    permission: 'members:manage',
    body: () => ({ role: 'experimenter' }),
  },
  { name: 'list designs', method: 'GET', path: c => `/api/labs/${c.lab.id}/designs`, permission: 'designs:view' },
  {
    name: 'create a design',
    method: 'POST',
    path: c => `/api/labs/${c.lab.id}/designs`,
    permission: 'designs:edit',
    body: () => ({ name: 'matrix', document: fixtureDocument() }),
  },
  {
    name: 'open a design',
    method: 'GET',
    path: c => `/api/labs/${c.lab.id}/designs/${c.designId}`,
    permission: 'designs:view',
  },
  // Restoring a design that is not archived changes nothing, but asks the same permission as archiving it. The
  // design was created by the designer: an experimenter (who may archive only their own) is refused.
  {
    name: 'archive or restore a design',
    method: 'PATCH',
    path: c => `/api/labs/${c.lab.id}/designs/${c.designId}`,
    permission: 'designs:archive',
    body: () => ({ archived: false }),
  },
  {
    name: 'rename a design',
    method: 'PATCH',
    path: c => `/api/labs/${c.lab.id}/designs/${c.designId}`,
    permission: 'designs:edit',
    body: () => ({ name: 'Cell drops T-junction' }),
  },
  {
    name: 'list revisions',
    method: 'GET',
    path: c => `/api/labs/${c.lab.id}/designs/${c.designId}/revisions`,
    permission: 'designs:view',
  },
  {
    name: 'save a revision',
    method: 'POST',
    path: c => `/api/labs/${c.lab.id}/designs/${c.designId}/revisions`,
    permission: 'designs:edit',
    body: c => ({ parentId: c.revisionId, message: 'm', document: fixtureDocument(), branch: true }),
  },
  {
    name: 'open a draft revision',
    method: 'GET',
    path: c => `/api/labs/${c.lab.id}/revisions/${c.revisionId}`,
    permission: 'designs:view',
  },
  {
    name: 'draft revision DXF',
    method: 'GET',
    path: c => `/api/labs/${c.lab.id}/revisions/${c.revisionId}/dxf`,
    permission: 'designs:view',
  },
  {
    name: 'draft revision DXF in the background',
    method: 'POST',
    path: c => `/api/labs/${c.lab.id}/revisions/${c.revisionId}/dxf-exports`,
    permission: 'designs:view',
  },
  {
    name: 'review state',
    method: 'GET',
    path: c => `/api/labs/${c.lab.id}/revisions/${c.revisionId}/review`,
    permission: 'designs:view',
  },
  {
    name: 'duplicate',
    method: 'POST',
    path: c => `/api/labs/${c.lab.id}/revisions/${c.revisionId}/duplicate`,
    permission: 'designs:edit',
    body: c => ({ targetLabId: c.lab.id, name: 'dup' }),
  },
  {
    name: 'request review',
    method: 'POST',
    path: c => `/api/labs/${c.lab.id}/revisions/${c.revisionId}/review-requests`,
    permission: 'designs:edit',
    body: c => ({ reviewerIds: [c.ids.reviewer] }),
  },
  {
    name: 'pin a comment',
    method: 'POST',
    path: c => `/api/labs/${c.lab.id}/revisions/${c.revisionId}/threads`,
    permission: 'review:comment',
    body: () => ({ anchor: { x: 1, y: 1 }, body: 'x' }),
  },
  {
    name: 'verdict',
    method: 'POST',
    path: c => `/api/labs/${c.lab.id}/revisions/${c.revisionId}/verdicts`,
    permission: 'review:verdict',
    body: () => ({ verdict: 'request-changes' }),
  },
  {
    name: 'release',
    method: 'POST',
    path: c => `/api/labs/${c.lab.id}/revisions/${c.revisionId}/release`,
    permission: 'release:manage',
    body: () => ({}),
  },
  {
    name: 'as-built report',
    method: 'GET',
    path: c => `/api/labs/${c.lab.id}/revisions/${orders.get(c)!.revisionId}/as-built`,
    permission: 'released:view',
    released: true,
  },
  // The fab records what it made, or the lab on receipt (who records measurements).
  {
    name: 'record an as-built',
    method: 'POST',
    path: c => `/api/labs/${c.lab.id}/revisions/${orders.get(c)!.revisionId}/as-built`,
    permission: 'released:view',
    allowed: r => can(r, 'fabrication:report') || can(r, 'measurements:record'),
    body: () => ({ depths: [{ layerId: 'ch50', depthUm: 51 }] }),
    released: true,
  },
  { name: 'list orders', method: 'GET', path: c => `/api/labs/${c.lab.id}/orders`, permission: 'released:view' },
  {
    name: 'open an order',
    method: 'GET',
    path: c => `/api/labs/${c.lab.id}/orders/${orders.get(c)!.orderId}`,
    permission: 'released:view',
  },
  {
    name: 'move an order',
    method: 'POST',
    path: c => `/api/labs/${c.lab.id}/orders/${orders.get(c)!.orderId}/status`,
    permission: 'fabrication:report',
    body: () => ({ status: 'on-hold', note: 'waiting for resist' }),
  },
  {
    name: 'write on an order',
    method: 'POST',
    path: c => `/api/labs/${c.lab.id}/orders/${orders.get(c)!.orderId}/messages`,
    permission: 'released:view',
    body: () => ({ body: 'matrix' }),
  },
  { name: 'list releases', method: 'GET', path: c => `/api/labs/${c.lab.id}/releases`, permission: 'released:view' },
]

let own: Ctx
let other: Ctx
/** Each lab's released revision and its order (the order routes); the design under test stays unreleased. */
const orders = new Map<Ctx, Awaited<ReturnType<typeof releasedOrder>>>()
beforeAll(async () => {
  own = await labWithDesign()
  other = await labWithDesign()
  for (const c of [own, other]) orders.set(c, await releasedOrder(c))
  // a review must be requested before verdicts; the revision stays unreleased (fabricators must not see it)
  await own.as.designer.post(`/api/labs/${own.lab.id}/revisions/${own.revisionId}/review-requests`, {
    reviewerIds: [own.ids.reviewer],
  })
}, 120_000)

describe('role matrix: every route × role × lab', () => {
  for (const route of ROUTES) {
    for (const role of ALL_ROLES) {
      const allowed = route.allowed ? route.allowed(role) : can(role, route.permission)
      it(`${route.name}: ${role} ${allowed ? 'passes' : 'is refused'} in their lab, and gets 404 in another`, async () => {
        const api = own.as[role as Role]
        const res = await api.request(route.method, route.path(own), route.body?.(own))
        // Someone who only sees released work (the fabricator) finds an unreleased revision simply not there.
        const unseen = !route.released && !can(role, 'designs:view') && route.path(own).includes('/revisions/')
        if (unseen && (allowed || route.permission === 'designs:view')) expect(res.status).toBe(404)
        else if (allowed) expect([401, 403, 404], `${res.status} ${JSON.stringify(res.json)}`).not.toContain(res.status)
        else expect(res.status).toBe(403)
        const foreign = await api.request(route.method, route.path(other), route.body?.(other))
        expect(foreign.status).toBe(404)
      })
    }
  }
})
