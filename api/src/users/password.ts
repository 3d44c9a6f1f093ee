import bcrypt from 'bcryptjs';

const COST = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export function checkPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

/** A fixed hash to compare against when the email is unknown, so both cases take the same time. */
export const DUMMY_HASH = bcrypt.hashSync('no-such-user-password', COST);
