import fs from 'node:fs';
import path from 'node:path';
import { createHmac, randomBytes } from 'node:crypto';

/**
 * The secret that signs session cookies: SESSION_SECRET, or one generated on first start
 * and kept in the data folder (mode 600) so sessions survive a restart.
 */
export function loadSessionSecret(env: NodeJS.ProcessEnv, dataDir: string): string {
  if (env.SESSION_SECRET) {
    if (env.SESSION_SECRET.length < 32) throw new Error('SESSION_SECRET must be at least 32 characters');
    return env.SESSION_SECRET;
  }
  const file = path.join(dataDir, 'session-secret');
  if (fs.existsSync(file)) return fs.readFileSync(file, 'utf8').trim();
  fs.mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(32).toString('base64url');
  fs.writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}

/** A separate key per use, derived from the one secret, so a CSRF token is never a valid cookie signature. */
export function deriveKey(secret: string, purpose: string): string {
  return createHmac('sha256', secret).update(purpose).digest('base64url');
}
