import { createHash, randomBytes, scrypt, timingSafeEqual } from 'node:crypto';

/**
 * Device secrets: 32 random bytes (base64url), shown once at pairing, stored as an scrypt
 * hash. Why these scrypt costs (N = 2^10, r = 8, p = 1, about 4 ms here, run on libuv's
 * thread pool): a slow password hash exists to make guessing a *weak* secret expensive;
 * a 256-bit random secret cannot be guessed at any hash speed, so the cost only has to
 * stay small enough that thousands of sensors reconnecting after a broker restart sign in
 * within seconds (5,000 × 4 ms over 2 cores ≈ 10 s). bcrypt at cost 10 takes about
 * 270 ms here: 5,000 reconnects would keep the broker busy for over 10 minutes.
 */
const SCRYPT_N = 1024;
const SCRYPT_R = 8;
const SCRYPT_P = 1;
const KEY_BYTES = 32;
const PREFIX = 'scrypt';

export function generateDeviceSecret(random: (size: number) => Buffer = randomBytes): string {
  return random(32).toString('base64url');
}

function derive(secret: string, salt: Buffer, n: number, r: number, p: number): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    scrypt(secret, salt, KEY_BYTES, { N: n, r, p, maxmem: 256 * n * r + 1024 * 1024 }, (error, key) =>
      error ? reject(error) : resolve(key),
    );
  });
}

/** `scrypt$N$r$p$salt$key`, salt and key in base64url. */
export async function hashDeviceSecret(secret: string, salt: Buffer = randomBytes(16)): Promise<string> {
  const key = await derive(secret, salt, SCRYPT_N, SCRYPT_R, SCRYPT_P);
  return [PREFIX, SCRYPT_N, SCRYPT_R, SCRYPT_P, salt.toString('base64url'), key.toString('base64url')].join('$');
}

export async function verifyDeviceSecret(secret: string, stored: string): Promise<boolean> {
  const parts = stored.split('$');
  if (parts.length !== 6 || parts[0] !== PREFIX) return false;
  const [n, r, p] = parts.slice(1, 4).map(Number);
  if (![n, r, p].every(Number.isInteger) || n > 1 << 16) return false;
  const expected = Buffer.from(parts[5], 'base64url');
  const actual = await derive(secret, Buffer.from(parts[4], 'base64url'), n, r, p);
  return actual.length === expected.length && timingSafeEqual(actual, expected);
}

/** A fast fingerprint of a secret that already passed scrypt, so reconnects skip the hash. */
export function secretFingerprint(secret: string | Buffer): string {
  return createHash('sha256').update(secret).digest('base64url');
}
