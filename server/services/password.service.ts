import { hash, verify } from '@node-rs/argon2'

/** argon2id; `Algorithm` is a const enum the isolated-module build cannot read, so its value (2) is spelled out. */
const ARGON2ID = 2

export function hashPassword(password: string): Promise<string> {
  return hash(password, { algorithm: ARGON2ID })
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password)
  } catch {
    return false
  }
}

let decoyHash: Promise<string> | null = null

/**
 * Spends the same time as a real check when the e-mail is unknown, so a wrong address and a wrong password answer
 * alike in time as well as in words.
 */
export async function verifyDecoy(password: string): Promise<false> {
  decoyHash ??= hashPassword('decoy password that never matches anything')
  await verifyPassword(await decoyHash, password)
  return false
}
