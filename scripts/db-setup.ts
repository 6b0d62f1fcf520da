// Applies the drizzle-kit migrations in migrations/ and, outside production, seeds the demo scenario once.
import { drizzle } from 'drizzle-orm/mysql2'
import { migrate } from 'drizzle-orm/mysql2/migrator'
import { randomUUID } from 'node:crypto'
import mysql, { type ResultSetHeader } from 'mysql2/promise'
import * as schema from '../server/db/schema'
import { seedDemo } from '../server/seed'
import { isRetryableConflict, parseDatabaseUrl } from '../server/utils/db'

const url = process.env.DATABASE_URL
if (!url) throw new Error('DATABASE_URL is not set')

/** The first host of DATABASE_URL (one, or the nodes of a Galera cluster) that answers. */
async function connectAny() {
  const address = parseDatabaseUrl(url!)
  let last: unknown
  for (const { host, port } of address.hosts) {
    try {
      const c = await mysql.createConnection({ host, port, user: address.user, password: address.password,
        database: address.database, timezone: 'Z', multipleStatements: false, connectTimeout: 5000 })
      // Causal reads on Galera (see server/utils/db.ts); harmless on one server.
      await c.query('SET SESSION wsrep_sync_wait = 1').catch(() => {})
      return c
    }
    catch (err) {
      last = err
    }
  }
  throw new Error(`no database host of DATABASE_URL answers: ${(last as Error)?.message}`)
}

const connection = await connectAny()
const db = drizzle(connection, { schema, mode: 'default' })
// Two instances starting together must not migrate at the same time. A lease row, not a named server lock: such a
// lock is local to one MariaDB node and Galera does not replicate it, while an UPDATE of one row is certified across
// the cluster.
// The lease expires, so an instance killed mid-migration does not block the next start for ever.
const LEASE_S = 120
const holder = randomUUID()
await connection.query('CREATE TABLE IF NOT EXISTS schema_lock (id TINYINT PRIMARY KEY, holder CHAR(36) NULL, lease_until DATETIME(3) NULL)')
await connection.query('INSERT IGNORE INTO schema_lock (id) VALUES (1)').catch((err) => {
  // Another node inserted it at the same moment (a certification conflict): the row is there either way.
  if (!isRetryableConflict(err)) throw err
})
const waitUntilMs = Date.now() + 2 * LEASE_S * 1000
for (;;) {
  // On Galera two nodes taking the row at once conflict at certification: the loser gets 1213 and waits its turn.
  const taken = await connection.query<ResultSetHeader>(
    'UPDATE schema_lock SET holder = ?, lease_until = NOW(3) + INTERVAL ? SECOND WHERE id = 1 AND (holder IS NULL OR lease_until < NOW(3))',
    [holder, LEASE_S],
  ).then(([r]) => r.affectedRows === 1, (err) => {
    if (isRetryableConflict(err)) return false
    throw err
  })
  if (taken) break
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
