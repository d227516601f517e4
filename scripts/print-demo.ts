// Prints where the app is and how to sign in to the demo.
import { DEMO_ACCOUNTS, DEMO_LABS, DEMO_PASSWORD } from '../server/db/demo'

const address = process.argv[2] ?? 'http://127.0.0.1:3000'
const labName = (slug: string) => DEMO_LABS.find(l => l.slug === slug)?.name ?? slug
console.log(`\nDropwright is starting at ${address}\n`)
console.log(`Demo accounts (password for all: ${DEMO_PASSWORD}):`)
for (const a of DEMO_ACCOUNTS) {
  const roles = a.memberships.map(m => `${m.role} in ${labName(m.lab)}`).join('; ')
  console.log(`  ${a.email.padEnd(34)} ${roles}`)
}
console.log('')
