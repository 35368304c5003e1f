/** Minimum length of an account password (common practice, no source). */
export const PASSWORD_MIN_LENGTH = 10;

/**
 * Checks a new account password against the policy: at least 10 characters, with a letter and a digit.
 * Returns the reason it fails, or null when it passes.
 */
export function passwordPolicyProblem(password: string): string | null {
  if (password.length < PASSWORD_MIN_LENGTH) return `must be at least ${PASSWORD_MIN_LENGTH} characters long`;
  if (!/\p{L}/u.test(password)) return 'must contain a letter';
  if (!/\p{Nd}/u.test(password)) return 'must contain a digit';
  return null;
}
