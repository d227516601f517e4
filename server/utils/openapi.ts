// The OpenAPI 3.1 document of the API a token may call (/api/v1/* and the lab routes), generated from the same zod
// schemas the routes validate with: zod 4's `z.toJSONSchema` (input side: what a client sends) plus this thin
// wrapper that places each schema in an operation. tests/unit/openapi.test.ts fails when a route under
// server/api/v1 or server/api/labs is missing here.
import { z } from 'zod'
import {
  designCreate,
  designListQuery,
  designUpdate,
  duplicateBody,
  dxfQuery,
  revisionCreate,
} from '#shared/schemas/designs'
import { documentRequest, junctionRequest, networkRequest } from '#shared/schemas/forecast'
import { planDocumentRequest, planJunctionRequest } from '#shared/schemas/plan'
import { invitationCreate } from '#shared/schemas/invitations'
import { memberRoleUpdate } from '#shared/schemas/labs'
import {
  benchRunCreate,
  calibrationQuery,
  forecastModeBody,
  micrographFileQuery,
  micrographUpdate,
} from '#shared/schemas/bench'
import { orderMessage, orderMove, releaseBody } from '#shared/schemas/orders'
import { asBuiltCreate } from '#shared/schemas/asBuilt'
import { commentCreate, reviewRequestBody, threadCreate, threadUpdate, verdictBody } from '#shared/schemas/review'
import {
  forecastQuery,
  libraryArchiveBody,
  libraryEntryCreateBody,
  libraryEntryUpdateBody,
  liquidsQuery,
  planQuery,
} from '#shared/schemas/libraries'
import { PERMISSION_LABELS, type Permission } from '#shared/utils/roles'

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete'
export interface Operation {
  method: Method
  path: string // OpenAPI style: /api/labs/{labId}/designs
  summary: string
  tag: 'Forecast' | 'Labs' | 'Designs' | 'Review' | 'Members' | 'Bench' | 'Fabrication'
  permission?: Permission
  body?: z.ZodType
  query?: z.ZodObject
  /** What a success answers with, in words (the answer types live in shared/types). */
  answers?: string
  status?: number
}

const forecastBody = z.union([junctionRequest, networkRequest, documentRequest])

export const OPERATIONS: Operation[] = [
  {
    method: 'post',
    path: '/api/v1/forecast',
    tag: 'Forecast',
    summary:
      "Forecast droplets for a junction, a channel network or a chip document (with ?lab= the lab's own liquids and pairs too)",
    body: forecastBody,
    query: forecastQuery,
    answers: 'the forecast, each quantity with its method and source (docs/forecast-api.md)',
  },
  {
    method: 'post',
    path: '/api/v1/plan',
    tag: 'Forecast',
    summary:
      "Plan a droplet generator: from a target droplet to an operating window, a recommended point, geometry, loading and a run plan (with ?lab= the lab's own liquids, pairs and processes too)",
    body: z.union([planJunctionRequest, planDocumentRequest]),
    query: planQuery,
    answers: 'window, recommended, geometry, encapsulation, each quantity with its method and source (docs/planner.md)',
  },
  {
    method: 'get',
    path: '/api/v1/liquids',
    tag: 'Forecast',
    query: liquidsQuery,
    summary:
      'The built-in liquids, pairs and surfactants, each value with its source; with ?lab= also that lab\'s own entries and processes (origin "lab")',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/libraries',
    tag: 'Labs',
    permission: 'designs:view',
    summary: "The lab's own liquids, liquid pairs and fabrication processes (archived ones included)",
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/libraries',
    tag: 'Labs',
    permission: 'libraries:manage',
    body: libraryEntryCreateBody,
    status: 201,
    summary: "Add a liquid, a liquid pair or a fabrication process to the lab's library",
  },
  {
    method: 'patch',
    path: '/api/labs/{labId}/libraries/{entryId}',
    tag: 'Labs',
    permission: 'libraries:manage',
    body: libraryEntryUpdateBody,
    summary: 'Change the values of one library entry (saved revisions keep theirs)',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/libraries/{entryId}/archive',
    tag: 'Labs',
    permission: 'libraries:manage',
    body: libraryArchiveBody,
    summary: 'Archive or restore one library entry',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/revisions/{revisionId}/reforecast',
    tag: 'Designs',
    permission: 'designs:view',
    summary:
      "The revision forecast again with the lab's current library, beside the stored forecast, with the differences",
  },
  {
    method: 'get',
    path: '/api/labs',
    tag: 'Labs',
    summary: "The labs the caller works in (with a token: the token's lab)",
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/designs',
    tag: 'Designs',
    permission: 'designs:view',
    query: designListQuery,
    summary: "List the lab's designs, one page at a time",
    answers: "the page's design rows (an array); the total in the X-Total-Count header, with X-Page and X-Page-Size",
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/designs',
    tag: 'Designs',
    permission: 'designs:edit',
    body: designCreate,
    status: 201,
    summary: 'Create a design with its first revision',
    answers: '{ designId, revisionId }',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/designs/{designId}',
    tag: 'Designs',
    permission: 'designs:view',
    summary: 'A design with its latest revision and activity',
  },
  {
    method: 'patch',
    path: '/api/labs/{labId}/designs/{designId}',
    tag: 'Designs',
    permission: 'designs:edit',
    body: designUpdate,
    summary: 'Rename, archive or restore a design',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/designs/{designId}/revisions',
    tag: 'Designs',
    permission: 'designs:view',
    summary: "The design's revisions, oldest first",
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/designs/{designId}/revisions',
    tag: 'Designs',
    permission: 'designs:edit',
    body: revisionCreate,
    status: 201,
    summary: 'Save a new revision (409 when the parent is no longer the latest)',
    answers: '{ revisionId, number }',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/revisions/{revisionId}',
    tag: 'Designs',
    permission: 'released:view',
    summary: 'A revision with its chip document and summary',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/revisions/{revisionId}/dxf',
    tag: 'Designs',
    permission: 'released:view',
    query: dxfQuery,
    summary: "The revision's mask as a DXF file",
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/revisions/{revisionId}/dxf-exports',
    tag: 'Designs',
    permission: 'released:view',
    query: dxfQuery,
    summary: 'Start making the mask DXF in the background (202 with the export to poll; for large chips)',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/revisions/{revisionId}/dxf-exports/{exportId}',
    tag: 'Designs',
    permission: 'released:view',
    summary: 'Where a background mask export is: queued, making, ready (with its file URL) or failed (with why)',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/revisions/{revisionId}/dxf-exports/{exportId}/file',
    tag: 'Designs',
    permission: 'released:view',
    summary: 'The DXF file of a finished background mask export',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/revisions/{revisionId}/duplicate',
    tag: 'Designs',
    permission: 'designs:view',
    body: duplicateBody,
    status: 201,
    summary: 'Copy a revision into a new design',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/inbox',
    tag: 'Review',
    permission: 'lab:view',
    summary:
      "The caller's lab overview: recent designs, revisions waiting for their verdict, their open comment threads",
    answers: '{ recentDesigns, waitingForMe, myOpenThreads } (empty for a role that sees released work only)',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/releases',
    tag: 'Designs',
    permission: 'released:view',
    summary: 'Revisions released for fabrication',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/revisions/{revisionId}/release',
    tag: 'Review',
    permission: 'release:manage',
    body: releaseBody,
    status: 201,
    summary: 'Release an approved revision to fabrication',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/revisions/{revisionId}/as-built',
    tag: 'Fabrication',
    permission: 'released:view',
    summary:
      'The latest as-built report of a released revision beside the drawn chip: forecast, rules and what changed',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/revisions/{revisionId}/as-built',
    tag: 'Fabrication',
    permission: 'fabrication:report',
    body: asBuiltCreate,
    status: 201,
    summary:
      'Record measured depths per layer and widths at named features (the fab, or the lab with measurements:record)',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/revisions/{revisionId}/as-built/{asBuiltId}/files',
    tag: 'Fabrication',
    permission: 'fabrication:report',
    status: 201,
    summary: 'Attach a profilometer CSV or a photo (multipart, field "file", checked on its bytes)',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/revisions/{revisionId}/as-built/{asBuiltId}/files/{fileId}',
    tag: 'Fabrication',
    permission: 'released:view',
    summary: 'Download a file of an as-built report',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/revisions/{revisionId}/fab-sheet.pdf',
    tag: 'Fabrication',
    permission: 'released:view',
    summary:
      'The fab sheet as a PDF: the chip to scale, layers and depths, mask, process, findings, operating point and cautions',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/orders',
    tag: 'Fabrication',
    permission: 'released:view',
    summary: "The lab's fabrication orders (the fab's queue)",
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/orders/{orderId}',
    tag: 'Fabrication',
    permission: 'released:view',
    summary: 'An order with its thread and the files the fab needs (DXF per layer, fab sheet)',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/orders/{orderId}/status',
    tag: 'Fabrication',
    permission: 'fabrication:report',
    body: orderMove,
    summary:
      'Move an order: received → in fabrication → shipped (with a tracking number) → delivered, or on hold with a reason',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/orders/{orderId}/messages',
    tag: 'Fabrication',
    permission: 'released:view',
    body: orderMessage,
    status: 201,
    summary: "Write to the order's thread between lab and fab",
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/revisions/{revisionId}/review',
    tag: 'Review',
    permission: 'released:view',
    summary: 'Review state, verdicts and comment threads of a revision',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/revisions/{revisionId}/review-requests',
    tag: 'Review',
    permission: 'designs:edit',
    body: reviewRequestBody,
    status: 201,
    summary: 'Ask lab members to review a revision',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/revisions/{revisionId}/verdicts',
    tag: 'Review',
    permission: 'review:verdict',
    body: verdictBody,
    status: 201,
    summary: 'Approve or request changes',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/revisions/{revisionId}/threads',
    tag: 'Review',
    permission: 'review:comment',
    body: threadCreate,
    status: 201,
    summary: 'Start a comment thread pinned to a point of the chip (µm)',
  },
  {
    method: 'patch',
    path: '/api/labs/{labId}/revisions/{revisionId}/threads/{threadId}',
    tag: 'Review',
    permission: 'review:comment',
    body: threadUpdate,
    summary: 'Resolve or reopen a thread',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/revisions/{revisionId}/threads/{threadId}/comments',
    tag: 'Review',
    permission: 'review:comment',
    body: commentCreate,
    status: 201,
    summary: 'Reply in a thread',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/revisions/{revisionId}/bench-runs',
    tag: 'Bench',
    permission: 'designs:view',
    summary: 'Bench runs of a revision, each measured against its forecast (docs/bench-results.md)',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/revisions/{revisionId}/bench-runs',
    tag: 'Bench',
    permission: 'measurements:record',
    body: benchRunCreate,
    status: 201,
    summary: 'Record a bench run: typed sizes as JSON, or a text/csv body of measured sizes',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/bench-runs/{runId}',
    tag: 'Bench',
    permission: 'designs:view',
    summary: 'A bench run with its measurements and micrographs',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/bench-runs/{runId}/micrographs',
    tag: 'Bench',
    permission: 'measurements:record',
    status: 201,
    summary:
      'Upload a micrograph (multipart: PNG, JPEG or TIFF and its scale); answers the detected drops, or 202 while measuring',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/bench-runs/{runId}/micrographs/{micrographId}',
    tag: 'Bench',
    permission: 'designs:view',
    summary: "A micrograph's detected drops and measuring progress",
  },
  {
    method: 'patch',
    path: '/api/labs/{labId}/bench-runs/{runId}/micrographs/{micrographId}',
    tag: 'Bench',
    permission: 'measurements:record',
    body: micrographUpdate,
    summary: 'Exclude false detections',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/bench-runs/{runId}/micrographs/{micrographId}/file',
    tag: 'Bench',
    permission: 'designs:view',
    query: micrographFileQuery,
    summary: 'The micrograph image (original, view or thumbnail)',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/calibrations',
    tag: 'Bench',
    permission: 'designs:view',
    query: calibrationQuery,
    summary: "The lab's calibrations per junction kind, with standard error and interval",
  },
  {
    method: 'put',
    path: '/api/labs/{labId}/calibrations/forecast-mode',
    tag: 'Bench',
    permission: 'designs:edit',
    body: forecastModeBody,
    summary: 'Switch a design between the model and the lab-calibrated forecast',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/members',
    tag: 'Members',
    permission: 'members:view',
    summary: "The lab's members and their roles",
  },
  {
    method: 'patch',
    path: '/api/labs/{labId}/members/{userId}',
    tag: 'Members',
    permission: 'members:manage',
    body: memberRoleUpdate,
    summary: "Change a member's role",
  },
  {
    method: 'delete',
    path: '/api/labs/{labId}/members/{userId}',
    tag: 'Members',
    permission: 'members:manage',
    summary: 'Remove a member from the lab',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/invitations',
    tag: 'Members',
    permission: 'members:manage',
    summary: 'Open invitations',
  },
  {
    method: 'post',
    path: '/api/labs/{labId}/invitations',
    tag: 'Members',
    permission: 'members:manage',
    body: invitationCreate,
    status: 201,
    summary: 'Invite someone by e-mail',
  },
  {
    method: 'delete',
    path: '/api/labs/{labId}/invitations/{invitationId}',
    tag: 'Members',
    permission: 'members:manage',
    summary: 'Withdraw an invitation',
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/jobs/failed',
    tag: 'Labs',
    permission: 'members:manage',
    summary: "The lab's failed background jobs",
  },
  {
    method: 'get',
    path: '/api/labs/{labId}/outbox',
    tag: 'Labs',
    permission: 'members:manage',
    summary: 'Development outbox (only with the local fake SMTP)',
  },
]

const jsonSchema = (schema: z.ZodType) =>
  z.toJSONSchema(schema, { io: 'input', unrepresentable: 'any', target: 'draft-2020-12' })

const problem = (description: string) => ({
  description,
  content: {
    'application/json': {
      schema: {
        type: 'object',
        properties: { statusCode: { type: 'integer' }, message: { type: 'string' }, data: {} },
      },
    },
  },
})

export function openApiDocument(serverUrl: string) {
  const paths: Record<string, Record<string, unknown>> = {}
  for (const op of OPERATIONS) {
    const pathParams = [...op.path.matchAll(/\{(\w+)\}/g)].map(m => ({
      name: m[1],
      in: 'path',
      required: true,
      schema: { type: 'string', format: 'uuid' },
    }))
    const queryParams = op.query
      ? Object.entries(
          (jsonSchema(op.query) as { properties?: Record<string, unknown>; required?: string[] }).properties ?? {},
        ).map(([name, schema]) => ({ name, in: 'query', required: false, schema }))
      : []
    const responses: Record<string, unknown> = {
      [String(op.status ?? 200)]: { description: op.answers ?? 'OK' },
      401: problem('No token or session, or a token that does not work any more'),
    }
    if (op.permission) {
      responses[403] = problem(
        `The caller's role may not: needs "${PERMISSION_LABELS[op.permission]}" (${op.permission})`,
      )
      responses[404] = problem("Not in this lab, or no such thing in it (another lab's ids are 404 too)")
    }
    if (op.body) responses[400] = problem('The body is invalid: the message names each field and what it must be')
    ;(paths[op.path] ??= {})[op.method] = {
      summary: op.summary,
      tags: [op.tag],
      operationId: `${op.method}${op.path
        .replace(/\{(\w+)\}/g, 'By-$1')
        .split(/[/-]/)
        .map(w => (w ? w[0]!.toUpperCase() + w.slice(1) : ''))
        .join('')}`,
      ...(op.permission ? { 'x-permission': op.permission } : {}),
      parameters: [...pathParams, ...queryParams],
      ...(op.body
        ? { requestBody: { required: true, content: { 'application/json': { schema: jsonSchema(op.body) } } } }
        : {}),
      responses,
    }
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Dropwright API',
      version: '1',
      description:
        'Design, review and forecast droplet-generating chips from scripts. Authenticate with a personal API token ' +
        '(account page) as `Authorization: Bearer dwt_…`: it works in one lab with the role it was made with. ' +
        'Quantities are SI numbers or strings with units ("100 um", "5 uL/min").',
    },
    servers: [{ url: serverUrl }],
    security: [{ bearer: [] }],
    components: {
      securitySchemes: { bearer: { type: 'http', scheme: 'bearer', description: 'A personal API token, dwt_…' } },
    },
    paths,
  }
}
