import type { User } from '../../db/schema';
import { PASSWORD_RECHECK_LIMIT } from '../rate-limit';
import { requireAttemptAllowed } from './attempt-limits';
import { HttpError } from './http';
import { verifyPassword } from './password';

export const PASSWORD_RECHECK = 'password-recheck';

/**
 * A signed-in person re-entering their password (to change it, or to turn the second factor off):
 * limited per account in the database, so a stolen session cannot guess the password; a wrong one is
 * a 400 naming `field`, too many a 429 with Retry-After.
 */
export async function requireRightPassword(
  user: Pick<User, 'id' | 'passwordHash'>,
  password: string,
  field: string,
): Promise<void> {
  const attempt = await requireAttemptAllowed(PASSWORD_RECHECK, user.id, PASSWORD_RECHECK_LIMIT, 'wrong passwords');
  if (!(await verifyPassword(user.passwordHash, password))) {
    throw new HttpError(400, `${field}: the password is not right.`, { [field]: 'not right' });
  }
  await attempt.forgive();
}
