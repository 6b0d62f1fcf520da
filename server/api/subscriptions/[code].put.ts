import { z } from 'zod'
import { airfieldCodeParamSchema } from '#shared/utils/airfield-schema'
import { loadAirfield } from '../../domain/airfields/lookup'
import { follow } from '../../domain/alerts/subscriptions'

const bodySchema = z.object({
  email: z.boolean({ required_error: 'email is required (true or false)' }),
  push: z.boolean({ required_error: 'push is required (true or false)' }),
})

// Follows an airfield (or changes the channels). The in-app inbox always receives its alerts.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const { code } = readParams(event, airfieldCodeParamSchema)
  const body = await readBodyWith(event, bodySchema)
  return follow(user.id, await loadAirfield(code), body)
})
