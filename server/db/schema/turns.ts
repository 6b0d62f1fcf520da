import { mysqlTable, varchar, bigint } from 'drizzle-orm/mysql-core'

// Turn rows: "only one at a time" for a key, across the nodes of a Galera cluster too. A transaction that must not
// run beside another of the same key writes the key's row first (takeTurn in server/utils/db.ts): on one server the
// row lock makes the second wait; on Galera, where row locks are local to a node, the second writer of the row is
// aborted at COMMIT by certification (1213) and transaction() runs it again, after the first. Keys:
// 'airfield:<id>' (filing and alert evaluation), 'sign-in:email:<e-mail>', 'sign-in:address:<address>',
// 'demo:<code>:<valid from>:<source>' (the demo days).
export const writeTurns = mysqlTable('write_turns', {
  turnKey: varchar('turn_key', { length: 330 }).primaryKey(),
  seq: bigint('seq', { mode: 'number' }).notNull().default(0),
})
