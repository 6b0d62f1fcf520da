import { eq } from 'drizzle-orm'
import type { MySql2Database } from 'drizzle-orm/mysql2'
import * as schema from '../db/schema'
import { transaction, type DB } from '../utils/db'
import { seedUsers } from './users'
import { seedDemoAirfields } from './demo-airfields'
import { seedDemoAlerts } from './demo-alerts'

export type SeedDB = MySql2Database<typeof schema>
export type SeedPart = { name: string, run: (tx: SeedDB) => Promise<void> }

// Demo parts in order; each runs once per database (marked in app_meta) inside one transaction.
const parts: SeedPart[] = [
  { name: 'users', run: seedUsers },
  { name: 'demo-airfields', run: seedDemoAirfields },
  { name: 'demo-alerts', run: seedDemoAlerts },
]

export async function seedDemo(db: SeedDB): Promise<string[]> {
  const ran: string[] = []
  for (const part of parts) {
    const key = `seed:${part.name}`
    const done = await db.select().from(schema.appMeta).where(eq(schema.appMeta.key, key))
    if (done.length) continue
    await transaction(async (tx) => {
      await part.run(tx as unknown as SeedDB)
      await tx.insert(schema.appMeta).values({ key, value: new Date().toISOString() })
    }, { db: db as unknown as DB })
    ran.push(part.name)
  }
  return ran
}
