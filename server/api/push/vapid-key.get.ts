import { vapidKeys } from '../../domain/alerts/push'

// The VAPID public key a browser needs for pushManager.subscribe({ applicationServerKey }).
export default defineApiHandler(async (event) => {
  await requireUser(event)
  return { publicKey: (await vapidKeys(useDB())).publicKey }
})
