import { acceptToken } from '../../domain/accounts/accept-token'

// Public: the invited person sets a password with the link's token (single use) and is signed in.
export default defineEventHandler(event => acceptToken(event, 'invitation'))
