/** Minimum length of an account password (common practice, no source). */
export const PASSWORD_MIN_LENGTH = 10;
/** bcrypt reads at most 72 bytes of a password (Provos and Mazières, "A Future-Adaptable Password Scheme", 1999). */
export const PASSWORD_MAX_BYTES = 72;

/** UTF-8 length of `text` in bytes (a lone surrogate counts as the 3-byte replacement character). */
function utf8Bytes(text: string): number {
  let bytes = 0;
  for (const char of text) {
    const code = char.codePointAt(0) ?? 0;
    bytes += code < 0x80 ? 1 : code < 0x800 ? 2 : code < 0x10000 ? 3 : 4;
  }
  return bytes;
}

/**
 * Checks a new account password against the policy: at least 10 characters, with a letter and a digit, and
 * no more than the 72 bytes (UTF-8) the hash uses, so that no part of a password is silently ignored.
 * Returns the reason it fails, or null when it passes.
 */
export function passwordPolicyProblem(password: string): string | null {
  if (password.length < PASSWORD_MIN_LENGTH) return `must be at least ${PASSWORD_MIN_LENGTH} characters long`;
  if (!/\p{L}/u.test(password)) return 'must contain a letter';
  if (!/\p{Nd}/u.test(password)) return 'must contain a digit';
  if (utf8Bytes(password) > PASSWORD_MAX_BYTES)
    return `must be at most ${PASSWORD_MAX_BYTES} bytes in UTF-8 (the password hash uses no more)`;
  return null;
}
