// Builds a lab with one person per role and a design in it, through the real API.
import { ApiClient } from './api'
import { fixtureDocument, makeLab, TEST_PASSWORD } from './factory'
import { ROLES, type Role } from '../../shared/utils/roles'

export const ALL_ROLES: Role[] = [...ROLES]

export async function labWithDesign() {
  const { lab, people } = await makeLab(ALL_ROLES)
  const clients = {} as Record<Role, ApiClient>
  const ids = {} as Record<Role, string>
  for (const p of people) {
    clients[p.role] = await new ApiClient().signIn(p.email, TEST_PASSWORD)
    ids[p.role] = p.id
  }
  const created = await clients.designer.post(`/api/labs/${lab.id}/designs`, {
    name: 'Cell drops T-junction',
    document: fixtureDocument(),
  })
  if (created.status !== 201) throw new Error(`create failed: ${created.status} ${JSON.stringify(created.json)}`)
  return {
    lab,
    as: clients,
    ids,
    designId: created.json.designId as string,
    revisionId: created.json.revisionId as string,
  }
}

/** A lab with one designer, signed in, and one design of the fixture chip, made through the API. */
export async function designerWithDesign(name: string) {
  const { lab, people } = await makeLab(['designer'])
  const email = people[0]!.email
  const api = await new ApiClient().signIn(email, TEST_PASSWORD)
  const created = await api.post(`/api/labs/${lab.id}/designs`, { name, document: fixtureDocument() })
  if (created.status !== 201) throw new Error(`create failed: ${created.status} ${JSON.stringify(created.json)}`)
  return {
    labId: lab.id,
    email,
    api,
    designId: created.json.designId as string,
    revisionId: created.json.revisionId as string,
  }
}
