// The account forms' limits, without the schemas of lib/validations/user.ts: the sign-up and new-password forms
// print them before anything is typed, and must not bring the validation library along to do it.

export const PASSWORD_MIN_LENGTH = 10;
/** bcrypt reads only the first 72 bytes of a password: longer ones are refused, never cut. */
export const PASSWORD_MAX_BYTES = 72;
