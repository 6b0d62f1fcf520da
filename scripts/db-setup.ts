// Applies the drizzle-kit migrations in migrations/ and, outside production, seeds the demo scenario once.
import { drizzle } from 'drizzle-orm/mysql2'
import { migrate } from 'drizzle-orm/mysql2/migrator'
import mysql from 'mysql2/promise'
import * as schema from '../server/db/schema'
import { seedDemo } from '../server/seed'

const url = process.env.DATABASE_URL
if (!url) throw new Error('DATABASE_URL is not set')

const connection = await mysql.createConnection({ uri: url, timezone: 'Z', multipleStatements: false })
const db = drizzle(connection, { schema, mode: 'default' })
// Two instances starting together must not migrate at the same time.
await connection.query('SELECT GET_LOCK(\'veerline_migrate\', 60)')
try {
  await migrate(db, { migrationsFolder: new URL('../migrations', import.meta.url).pathname })
  if (process.env.NODE_ENV === 'production' || process.env.VEERLINE_SEED_DEMO === '0') {
    console.log('[veerline] demo scenario not seeded (production)')
  }
  else {
    const ran = await seedDemo(db)
    console.log(ran.length ? `[veerline] seeded demo: ${ran.join(', ')}` : '[veerline] demo already seeded')
  }
}
finally {
  await connection.query('SELECT RELEASE_LOCK(\'veerline_migrate\')')
  await connection.end()
}
