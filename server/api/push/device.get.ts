import { simulatedDeliveriesOf } from '../../domain/alerts/push-subscriptions'

// What the push-service stand-in received (verified and decrypted) for the signed-in user's simulated devices.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  return simulatedDeliveriesOf(user.id)
})
