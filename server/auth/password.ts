/**
 * Password hashing with argon2id. The parameters are the OWASP Password Storage Cheat Sheet minimum for
 * argon2id: 19 MiB of memory (m=19456 KiB), 2 iterations (t=2), 1 degree of parallelism (p=1).
 * @node-rs/argon2 defaults to the argon2id variant; the encoded hash records all of this.
 */
import { hash, verify } from '@node-rs/argon2';

export const ARGON2_OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON2_OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    // A malformed stored hash is a failed sign-in, not a server error.
    return false;
  }
}

let dummyHash: Promise<string> | undefined;

/**
 * Verifies against a throw-away hash so an unknown e-mail costs about as long as a wrong password
 * and response times don't reveal which accounts exist.
 */
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= hashPassword('no account has this password, it only spends time');
  await verifyPassword(await dummyHash, password);
  return false;
}
