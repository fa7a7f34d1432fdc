/**
 * The one spelling of an e-mail address the app stores, looks up and rate-limits by: trimmed and
 * lower-cased, so `Ann@Example.test ` and `ann@example.test` are one account.
 */
export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}
