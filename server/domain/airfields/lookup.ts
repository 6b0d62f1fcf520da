import type { Airfield } from '../../db/schema'
import { eq, schema, useDB } from '../../utils/db'
import type { DB, Tx } from '../../utils/db'
import { notFound } from '../../utils/errors'

/** The airfield with this ICAO-style code (any case), or null. */
export async function findAirfield(code: string, db: DB | Tx = useDB()): Promise<Airfield | null> {
  const [row] = await db.select().from(schema.airfields).where(eq(schema.airfields.code, code.toUpperCase()))
  return row ?? null
}

/** The one airfield loader with its 404: every route that names an airfield goes through here. */
export async function loadAirfield(code: string, db: DB | Tx = useDB()): Promise<Airfield> {
  const row = await findAirfield(code, db)
  if (!row) throw notFound(`No airfield with the code ${code.toUpperCase()}`)
  return row
}
