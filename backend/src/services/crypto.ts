import { createHash, createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import argon2 from 'argon2';

/** argon2id with the library's defaults (m = 64 MiB, t = 3, p = 4). */
export const hashPassword = (password: string) => argon2.hash(password, { type: argon2.argon2id });
export const verifyPassword = (hash: string, password: string) => argon2.verify(hash, password).catch(() => false);

/** A fixed hash verified when the e-mail is unknown, so both failures take the same time. */
let dummyHash: Promise<string> | undefined;
export const dummyVerify = async (password: string) => {
  dummyHash ??= hashPassword('veracast-dummy-password-for-timing');
  await verifyPassword(await dummyHash, password);
  return false;
};

/** A URL-safe random secret with `bytes` bytes of entropy. */
export const randomToken = (bytes = 32) => randomBytes(bytes).toString('base64url');
/** SHA-256 hex of a secret: what the database stores for one-time and API tokens. */
export const sha256 = (value: string) => createHash('sha256').update(value).digest('hex');
export const hmac = (secret: string, value: string) => createHmac('sha256', secret).update(value).digest('base64url');

export function safeEqual(a: string, b: string): boolean {
  const ab = Buffer.from(a);
  const bb = Buffer.from(b);
  return ab.length === bb.length && timingSafeEqual(ab, bb);
}
