import { randomBytes, scrypt, timingSafeEqual, type ScryptOptions } from 'node:crypto';

/**
 * Password hashing with scrypt (memory-hard; RFC 7914) from node:crypto.
 *
 * Stored form: `scrypt$<log2 N>$<r>$<p>$<salt>$<hash>` (salt and hash in
 * base64url), so the cost can be raised later without breaking old hashes.
 * N = 2^15, r = 8, p = 1 needs 32 MiB per hash: the cost OWASP's Password
 * Storage Cheat Sheet lists as a scrypt minimum is N = 2^17 at 128 MiB; we take
 * a lower N because one small machine also runs the database and the tests
 * (a deliberate trade-off: raise LOG2_N for a deployment with memory to spare).
 * Lives in `database` because the demo seed and the api both write hashes.
 */
const LOG2_N = 15;
const R = 8;
const P = 1;
const KEY_LENGTH = 32;
const SALT_LENGTH = 16;

function derive(password: string, salt: Buffer, log2n: number, r: number, p: number): Promise<Buffer> {
  const options: ScryptOptions = { N: 2 ** log2n, r, p, maxmem: 256 * 2 ** log2n * r * p };
  return new Promise((resolve, reject) => {
    scrypt(password.normalize('NFKC'), salt, KEY_LENGTH, options, (err, key) => (err ? reject(err) : resolve(key)));
  });
}

/** Hashes a password with a fresh random salt. */
export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(SALT_LENGTH);
  const key = await derive(password, salt, LOG2_N, R, P);
  return ['scrypt', LOG2_N, R, P, salt.toString('base64url'), key.toString('base64url')].join('$');
}

/**
 * A hash of a random password nobody knows. Checking against it when the
 * account is unknown (or has no password yet) makes those sign-ins cost the
 * same time as a wrong password, so timing does not reveal which e-mails exist.
 */
export const DUMMY_PASSWORD_HASH =
  'scrypt$15$8$1$pBk251SbkL4tly-Br5U2Fg$SzNABpplVguWKvfsq7mAMivxLR6tIgM_A_fVuagYwns';

/**
 * True when `password` matches `stored`. A missing or malformed hash is
 * compared against DUMMY_PASSWORD_HASH and always gives false.
 */
export async function verifyPassword(password: string, stored: string | null): Promise<boolean> {
  const parsed = parse(stored);
  const target = parsed ?? parse(DUMMY_PASSWORD_HASH)!;
  const key = await derive(password, target.salt, target.log2n, target.r, target.p);
  return parsed !== null && key.length === target.key.length && timingSafeEqual(key, target.key);
}

function parse(stored: string | null) {
  const parts = stored?.split('$');
  if (!parts || parts.length !== 6 || parts[0] !== 'scrypt') return null;
  const [log2n, r, p] = parts.slice(1, 4).map(Number);
  if (![log2n, r, p].every((n) => Number.isInteger(n) && n > 0) || log2n > 20) return null;
  return { log2n, r, p, salt: Buffer.from(parts[4], 'base64url'), key: Buffer.from(parts[5], 'base64url') };
}
