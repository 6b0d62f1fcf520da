import { z } from 'zod'
import { makeSimulatedDevice } from '../../domain/alerts/push-subscriptions'

const bodySchema = z.object({ label: z.string().trim().min(1).max(120).default('Simulated device') }).default({})

// Makes a simulated device on the local push-service stand-in (only where the stand-ins run).
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const body = await readBodyWith(event, bodySchema)
  const device = await makeSimulatedDevice(user, body.label)
  setResponseStatus(event, 201)
  return device
})
