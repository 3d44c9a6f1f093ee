import bcrypt from 'bcryptjs';
import { dictionary } from '@zxcvbn-ts/language-common';
import { PASSWORD_MAX_BYTES, passwordBytes } from '@crumbproof/shared';
import { AppError } from '../common/app-error';
import { DEMO_PASSWORD } from '../database/seeders/demo-users';

const COST = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

/**
 * bcrypt compares only the first 72 bytes, so a longer password would match any other with the
 * same start: it is refused (after the same work, so the answer takes the same time).
 */
export async function checkPassword(password: string, hash: string): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash);
  return ok && passwordBytes(password) <= PASSWORD_MAX_BYTES;
}

/** A fixed hash to compare against when the email is unknown, so both cases take the same time. */
export const DUMMY_HASH = bcrypt.hashSync('no-such-user-password', COST);

/**
 * The common-passwords list of zxcvbn-ts (@zxcvbn-ts/language-common, drawn from published
 * password leaks), lower case. NIST SP 800-63B section 5.1.1.2 asks that passwords found in
 * such lists be refused.
 */
const COMMON = new Set(dictionary['passwords-common']);

/**
 * Why a password the shared rule accepts is still refused, or null. Besides the list itself,
 * a listed password with digits or symbols around it ("sunshine2024!") is refused: guessing
 * tools try those first (common practice). The demo kitchen's password is published.
 */
export function commonPasswordProblem(password: string): string | null {
  const lower = password.toLowerCase();
  if (lower === DEMO_PASSWORD) return 'This is the demo kitchen’s password, which is published: choose another.';
  const core = lower.replace(/^[^\p{L}]+|[^\p{L}]+$/gu, '');
  if (COMMON.has(lower) || (core.length > 0 && COMMON.has(core))) {
    return 'This password is on a list of common passwords that are guessed first: choose another.';
  }
  return null;
}

/** Refuses a common password with a field error, as the other password rules are. */
export function refuseCommonPassword(password: string): void {
  const problem = commonPasswordProblem(password);
  if (problem)
    throw new AppError('validation', `Some fields need attention. password: ${problem}`, [{ path: 'password', message: problem }]);
}
