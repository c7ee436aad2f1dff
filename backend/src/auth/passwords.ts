import bcrypt from 'bcryptjs';

const BCRYPT_COST = Number(process.env.BCRYPT_COST ?? 10);

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

/** A fixed hash to compare against when the address is unknown, so timing does not tell. */
export const DUMMY_PASSWORD_HASH = bcrypt.hashSync('not-a-real-password-0000', BCRYPT_COST);
