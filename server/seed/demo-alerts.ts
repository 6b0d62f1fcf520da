/**
 * Demo subscriptions and the alerts the demo profiles raise: the demo pilot, dispatcher and safety officer follow the
 * three demo airfields by e-mail, and each airfield is evaluated once, as a filing would, so the demo starts with the
 * exceedances its profiles carry (the outbox worker mails them once the app runs). Demo only.
 */
import { inArray } from 'drizzle-orm'
import * as schema from '../db/schema'
import type { Tx } from '../utils/db'
import { evaluateAirfield } from '../domain/alerts/evaluate'
import { DEMO_AIRFIELDS } from './demo-airfields'
import type { SeedDB } from './index'

const FOLLOWERS = ['pilot@veerline.example', 'dispatch@veerline.example', 'safety@veerline.example']

export async function seedDemoAlerts(db: SeedDB) {
  const airfields = await db.select().from(schema.airfields).where(inArray(schema.airfields.code, DEMO_AIRFIELDS.map(a => a.code)))
  const users = await db.select().from(schema.users).where(inArray(schema.users.email, FOLLOWERS))
  for (const user of users) {
    for (const airfield of airfields) {
      await db.insert(schema.alertSubscriptions).values({ userId: user.id, airfieldId: airfield.id, email: true, push: false })
    }
  }
  const appUrl = process.env.NUXT_PUBLIC_APP_URL || `http://127.0.0.1:${process.env.VEERLINE_PORT || 3000}`
  for (const airfield of airfields) {
    await evaluateAirfield(db as unknown as Tx, airfield.id, { trigger: 'seed', actor: { label: 'demo seed' }, appUrl })
  }
}
