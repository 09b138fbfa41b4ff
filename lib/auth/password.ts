import bcrypt from 'bcryptjs';
import { config } from '@/lib/config';

// OWASP Password Storage Cheat Sheet: bcrypt with a work factor of at least 10.
const COST = config().NODE_ENV === 'test' ? 4 : 12;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

let dummyHash: Promise<string> | undefined;

// Compared against when the e-mail is unknown, so both paths cost the same time.
export function burnPasswordCheck(password: string): Promise<boolean> {
  dummyHash ??= bcrypt.hash('kerfline-no-such-user', COST);
  return dummyHash.then((hash) => bcrypt.compare(password, hash));
}
