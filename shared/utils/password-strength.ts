// How strong the first administrator's password must be. The first account of a deployment can do
// everything, so it gets a stricter check than the admin form's 10 characters: at least 12
// characters, at least three kinds of character (or a passphrase of 20 or more), not mostly one
// character, and not built from the address, the product's name or a well-known weak password.

export const FIRST_ADMIN_PASSWORD_MIN = 12

// Well-known weak passwords and the demo's own published one.
const WEAK = ['password', 'passw0rd', 'letmein', 'welcome', 'qwerty', 'qwertz', 'azerty', '123456', '12345678', 'abc123', 'admin', 'administrator', 'changeme', 'iloveyou', 'rimecase-demo', 'rimecase']

/** Why the password is too weak, or null when it is strong enough. */
export function passwordWeakness(password: string, about: { email?: string; name?: string } = {}): string | null {
  if (password.length < FIRST_ADMIN_PASSWORD_MIN) return `Use at least ${FIRST_ADMIN_PASSWORD_MIN} characters`
  const kinds = [/[a-z]/, /[A-Z]/, /[0-9]/, /[^A-Za-z0-9]/].filter((re) => re.test(password)).length
  if (kinds < 3 && password.length < 20) return 'Mix at least three of: lower-case letters, capitals, digits, other characters (or use a passphrase of 20 or more characters)'
  const counts = new Map<string, number>()
  for (const ch of password.toLowerCase()) counts.set(ch, (counts.get(ch) ?? 0) + 1)
  if (counts.size < 6 || Math.max(...counts.values()) > password.length / 2) return 'Use more different characters'
  const lower = password.toLowerCase()
  const bare = lower.replace(/[^a-z0-9]/g, '')
  if (WEAK.some((w) => bare === w.replace(/[^a-z0-9]/g, '') || (w.length >= 6 && bare.startsWith(w.replace(/[^a-z0-9]/g, '')) && bare.length - w.length < 6))) {
    return 'This password is too easy to guess'
  }
  const local = about.email?.split('@')[0]?.toLowerCase() ?? ''
  if (local.length >= 4 && lower.includes(local)) return 'Do not build the password from the e-mail address'
  const nameParts = (about.name ?? '').toLowerCase().split(/\s+/).filter((p) => p.length >= 4)
  if (nameParts.some((p) => lower.includes(p))) return 'Do not build the password from your name'
  return null
}
