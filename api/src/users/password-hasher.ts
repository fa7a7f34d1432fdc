import { hash, verify } from '@node-rs/argon2';

// argon2id with the library defaults (19 MiB, t=2, p=1): OWASP's minimum recommendation for argon2id.
export function hashPassword(password: string): Promise<string> {
  return hash(password);
}

export function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  return verify(passwordHash, password).catch(() => false);
}
