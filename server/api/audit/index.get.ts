import { auditQuerySchema } from '#shared/utils/profile-schema'
import { readAuditLog } from '../../domain/audit/log'

// The audit log, newest first, filtered; admins and safety officers read it.
export default defineApiHandler(async (event) => {
  await requireCapability(event, 'read-audit')
  const query = readQuery(event, auditQuerySchema)
  return readAuditLog(query)
})
