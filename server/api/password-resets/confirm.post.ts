import { acceptToken } from '../../domain/accounts/accept-token'

// Public: sets a new password with a reset link's token (single use, one hour) and signs the person in.
export default defineEventHandler(event => acceptToken(event, 'password-reset'))
