import { limitsOverview } from '../../domain/alerts/limit-views'

// Every limit set with what is in force: the organisation default and each airfield's override and runway ends.
export default defineApiHandler(async (event) => {
  await requireUser(event)
  return limitsOverview()
})
