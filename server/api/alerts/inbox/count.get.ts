import { unacknowledgedCount } from '../../../domain/alerts/inbox'
import { failedAlertNoticeCount } from '../../../domain/alerts/alert-log'

// How many inbox entries the signed-in user has not acknowledged (the badge in the navigation); for those who read the
// alert log, also how many alert notices failed for good, so the safety office sees a failure at once.
export default defineApiHandler(async (event) => {
  const user = await requireUser(event)
  const unacknowledged = await unacknowledgedCount(user.id)
  if (!can(user, 'read-alert-log')) return { unacknowledged }
  return { unacknowledged, failedAlertNotices: await failedAlertNoticeCount() }
})
