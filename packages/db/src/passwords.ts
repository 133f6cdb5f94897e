import { hash, verify } from '@node-rs/argon2';

/**
 * Password hashing: argon2id (the package default) with OWASP's minimum parameters
 * (19 MiB memory, 2 passes, 1 lane). The encoded hash carries its parameters, so
 * raising them later still verifies older hashes.
 */
const OPTIONS = { memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export const MIN_PASSWORD_LENGTH = 10;

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
