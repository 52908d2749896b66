/** A new password (invitation, change, reset): at least 12 characters, like the first admin's. */
export const NEW_PASSWORD_MIN = 12
