import bcrypt from 'bcryptjs';
import { PASSWORD_MAX_BYTES } from '@shared/schemas';
import { AppError } from '../http/errors';

const BCRYPT_COST = Number(process.env.BCRYPT_COST ?? 10);

/**
 * bcrypt reads only the first 72 bytes (bcryptjs README), so a longer password is refused here
 * too, behind the shared password schema: nothing is hashed that could sign in by its prefix.
 */
export function hashPassword(password: string): Promise<string> {
  if (bcrypt.truncates(password)) {
    return Promise.reject(AppError.validation(`The password is longer than bcrypt reads: use at most ${PASSWORD_MAX_BYTES} bytes.`, [{ field: 'password', message: `must be at most ${PASSWORD_MAX_BYTES} bytes` }]));
  }
  return bcrypt.hash(password, BCRYPT_COST);
}

/** A password longer than bcrypt reads never matches (only its first 72 bytes would be compared). */
export async function verifyPassword(password: string, hash: string): Promise<boolean> {
  if (bcrypt.truncates(password)) {
    await bcrypt.compare('', hash); // the same work, so timing does not tell
    return false;
  }
  return bcrypt.compare(password, hash);
}

/** A fixed hash to compare against when the address is unknown, so timing does not tell. */
export const DUMMY_PASSWORD_HASH = bcrypt.hashSync('not-a-real-password-0000', BCRYPT_COST);
