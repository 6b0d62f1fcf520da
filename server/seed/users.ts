import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import * as schema from '../db/schema'
import type { SeedDB } from './index'

// Demo only: invented people on a reserved example domain. The same scrypt defaults as nuxt-auth-utils.
export const DEMO_PASSWORD = 'veerline-demo'
export const demoUsers = [
  { email: 'admin@veerline.example', name: 'Ada Quillfeather', role: 'admin' },
  { email: 'dispatch@veerline.example', name: 'Dario Penwick', role: 'dispatcher' },
  { email: 'pilot@veerline.example', name: 'Priya Stormont', role: 'pilot' },
  { email: 'safety@veerline.example', name: 'Sol Marrowby', role: 'safety' },
] as const

export async function seedUsers(db: SeedDB) {
  const hash = new Hash(new Scrypt({}))
  const passwordHash = await hash.make(DEMO_PASSWORD)
  for (const u of demoUsers) {
    await db.insert(schema.users).values({ ...u, passwordHash })
  }
}
