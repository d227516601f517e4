// Idempotent demo seed: running it twice leaves the same rows. `tsx scripts/seed.ts [--test]`
import { sql } from 'drizzle-orm'
import { DEMO_ACCOUNTS, DEMO_LABS, DEMO_PASSWORD } from '../server/db/demo'
import { seedDemoBench } from '../server/db/demoBench'
import { seedDemoOrders } from '../server/db/demoOrders'
import { seedDemoLibrary } from '../server/db/demoLibrary'
import { seedDemoDesigns } from '../server/db/seedDesigns'
import { labs, memberships, users } from '../server/db/schema'
import { closeDb, useDb } from '../server/utils/db'
import { hashPassword } from '../server/utils/password'
import { loadDbEnv } from './load-env'

loadDbEnv(process.argv.includes('--test') ? 'test' : 'app')
const db = useDb()
const passwordHash = await hashPassword(DEMO_PASSWORD)

const labIds = new Map<string, string>()
const userIds = new Map<string, string>()
for (const lab of DEMO_LABS) {
  const [row] = await db
    .insert(labs)
    .values(lab)
    .onConflictDoUpdate({ target: labs.slug, set: { name: lab.name, kind: lab.kind } })
    .returning({ id: labs.id })
  labIds.set(lab.slug, row!.id)
}

for (const account of DEMO_ACCOUNTS) {
  const existing = await db
    .select({ id: users.id })
    .from(users)
    .where(sql`lower(${users.email}) = ${account.email}`)
  const userId =
    existing[0]?.id ??
    (
      await db
        .insert(users)
        .values({ email: account.email, name: account.name, passwordHash })
        .returning({ id: users.id })
    )[0]!.id
  userIds.set(account.email, userId)
  for (const m of account.memberships) {
    await db
      .insert(memberships)
      .values({ userId, labId: labIds.get(m.lab)!, role: m.role })
      .onConflictDoUpdate({ target: [memberships.userId, memberships.labId], set: { role: m.role } })
  }
}

const person = (role: string) => userIds.get(`${role}@quillmere.example`)!
await seedDemoLibrary(db, labIds.get('quillmere')!, person('admin'))
await seedDemoDesigns(db, labIds.get('quillmere')!, {
  admin: person('admin'),
  designer: person('designer'),
  reviewer: person('reviewer'),
  experimenter: person('experimenter'),
})
await seedDemoOrders(db, labIds.get('quillmere')!, {
  admin: person('admin'),
  fabricator: userIds.get('fabricator@brackenfold.example')!,
})

// Bench runs need the object storage (scripts/s3.sh); without it the demo has no bench results.
if (process.env.DW_S3_ENDPOINT || process.env.DW_S3_BUCKET)
  await seedDemoBench(db, labIds.get('quillmere')!, {
    designer: person('designer'),
    experimenter: person('experimenter'),
  })

await closeDb()
console.error(`[seed] demo data ready: ${DEMO_LABS.length} labs, ${DEMO_ACCOUNTS.length} accounts, 3 designs`)
