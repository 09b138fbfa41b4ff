// Session secrets: one kept for the local app, throwaway ones for test runs.
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { ROOT } from './proc.mjs';

export const randomSecret = () => crypto.randomBytes(32).toString('base64url');

export const sessionSecretFile = (root = ROOT) => path.join(root, '.data', 'session-secret');

/** Reads the secret from `file`, creating it (mode 600) on first use; sessions survive restarts. */
export function ensureSessionSecret(file = sessionSecretFile()) {
  try {
    const existing = fs.readFileSync(file, 'utf8').trim();
    if (existing) return existing;
  } catch (error) {
    if (error.code !== 'ENOENT') throw error;
  }
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const secret = randomSecret();
  fs.writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  fs.chmodSync(file, 0o600);
  return secret;
}
