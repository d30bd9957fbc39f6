/** The API lives on the same origin as the app; every path the client calls is named here. */
export const API_PATHS = {
  csrf: '/api/auth/csrf',
  login: '/api/auth/login',
  logout: '/api/auth/logout',
  me: '/api/auth/me',
  users: '/api/users',
  aircraftTypes: '/api/aircraft-types',
  airframes: '/api/airframes',
  audit: '/api/audit',
  mailbox: '/api/dev/mailbox',
  acceptInvitation: '/api/auth/invitations/accept',
  passwordReset: '/api/auth/password-reset',
  passwordResetConfirm: '/api/auth/password-reset/confirm',
  changePassword: '/api/auth/password',
  unlock: '/api/auth/unlock',
  health: '/api/health',
} as const;

/** The header the server reads the CSRF token from on every state-changing request. */
export const CSRF_HEADER = 'x-csrf-token';

/** Only our own API gets the CSRF token; it must never travel to another origin. */
export function isApiUrl(url: string): boolean {
  return url.startsWith('/api/');
}
