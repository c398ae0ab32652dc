import { dictionary } from '@zxcvbn-ts/language-common'

let common: Set<string> | undefined

/**
 * Refuse a password on zxcvbn-ts' common-password list (about 49,000 passwords seen in breaches),
 * which guessing attacks try first. Only the server holds the list; the form checks the length.
 */
export function refuseCommonPassword(field: string, password: string) {
  common ??= new Set(dictionary['passwords-common'])
  if (common.has(password.toLowerCase())) {
    badInput(field, 'That password is on a list of common passwords that are guessed first. Choose another; a few unrelated words work well.')
  }
}

let decoy: Promise<string> | undefined

/**
 * Check a password against an account's hash, or against a decoy hash when there is no such
 * account, so an unknown address takes as long to refuse as a wrong password.
 */
export async function passwordMatches(hash: string | undefined, password: string): Promise<boolean> {
  decoy ??= hashPassword('decoy password for unknown addresses')
  const matches = await verifyPassword(hash ?? await decoy, password)
  return Boolean(hash) && matches
}
