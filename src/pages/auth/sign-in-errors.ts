import { isApiError } from '../../api/http'

/** Turns a failed sign-in into words a crew member can act on, keyed by the server's error code. */
export function signInErrorMessage(err: unknown): string {
  if (!isApiError(err)) return 'Something went wrong. Try again.'
  switch (err.code) {
    case 'invalid_credentials':
      return 'That e-mail and password do not match an active account. Check both and try again.'
    case 'rate_limited':
      return 'Too many sign-in attempts from here. Wait a few minutes, then try again.'
    case 'network_error':
      return 'Could not reach the server. Check the connection and try again.'
    case 'validation_failed':
      return 'Enter your e-mail address and password.'
    default:
      return err.message || 'Sign-in failed. Try again.'
  }
}
