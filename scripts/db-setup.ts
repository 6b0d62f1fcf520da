// Applies the drizzle-kit migrations in migrations/ and, outside production, seeds the demo scenario once.
import { drizzle } from 'drizzle-orm/mysql2'
import { migrate } from 'drizzle-orm/mysql2/migrator'
import { randomUUID } from 'node:crypto'
import mysql, { type ResultSetHeader } from 'mysql2/promise'
import * as schema from '../server/db/schema'
import { seedDemo } from '../server/seed'

const url = process.env.DATABASE_URL
if (!url) throw new Error('DATABASE_URL is not set')

const connection = await mysql.createConnection({ uri: url, timezone: 'Z', multipleStatements: false })
const db = drizzle(connection, { schema, mode: 'default' })
// Two instances starting together must not migrate at the same time. A lease row, not GET_LOCK: GET_LOCK is local to
// one MariaDB node and Galera does not replicate it, while an UPDATE of one row is certified across the cluster.
// The lease expires, so an instance killed mid-migration does not block the next start for ever.
const LEASE_S = 120
const holder = randomUUID()
await connection.query('CREATE TABLE IF NOT EXISTS schema_lock (id TINYINT PRIMARY KEY, holder CHAR(36) NULL, lease_until DATETIME(3) NULL)')
await connection.query('INSERT IGNORE INTO schema_lock (id) VALUES (1)')
const waitUntilMs = Date.now() + 2 * LEASE_S * 1000
for (;;) {
  const [taken] = await connection.query<ResultSetHeader>(
    'UPDATE schema_lock SET holder = ?, lease_until = NOW(3) + INTERVAL ? SECOND WHERE id = 1 AND (holder IS NULL OR lease_until < NOW(3))',
    [holder, LEASE_S],
  )
  if (taken.affectedRows === 1) break
  if (Date.now() > waitUntilMs) throw new Error('Another instance has held the migration lock for too long (schema_lock)')
  await new Promise(resolve => setTimeout(resolve, 500))
}
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
  await connection.query('UPDATE schema_lock SET holder = NULL, lease_until = NULL WHERE id = 1 AND holder = ?', [holder])
  await connection.end()
}
