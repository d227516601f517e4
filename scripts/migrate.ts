// Applies the committed drizzle-kit migrations. `tsx scripts/migrate.ts [--test]`
import { migrate } from 'drizzle-orm/node-postgres/migrator'
import { closeDb, useDb } from '../server/utils/db'
import { loadDbEnv } from './load-env'

loadDbEnv(process.argv.includes('--test') ? 'test' : 'app')
await migrate(useDb(), { migrationsFolder: new URL('../server/db/migrations', import.meta.url).pathname })
await closeDb()
console.error('[db] migrations applied')
