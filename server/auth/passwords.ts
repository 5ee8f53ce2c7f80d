import bcrypt from 'bcryptjs';
import { z } from 'zod';

const COMMON = new Set(['password', 'password1', 'password123', '12345678', '123456789', '1234567890', 'qwertyuiop', 'qwerty123', 'iloveyou', 'letmein1', 'gluefield', 'abcdefgh', '11111111', '00000000']);

/**
 * A password good enough to keep: 8 or more characters, at most 72 bytes
 * (bcrypt ignores the rest), not a handful of repeated characters and not
 * one of the commonest passwords.
 */
export const passwordSchema = z
  .string()
  .min(8, { message: 'the password must have at least 8 characters' })
  .refine((p) => Buffer.byteLength(p, 'utf8') <= 72, { message: 'the password must be at most 72 bytes' })
  .refine((p) => new Set(p).size >= 4, { message: 'the password is too repetitive' })
  .refine((p) => !COMMON.has(p.toLowerCase()), { message: 'the password is too common' });

export function hashPassword(password: string, rounds: number): Promise<string> {
  return bcrypt.hash(password, rounds);
}

export function checkPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

/** A hash to compare against when the account does not exist, so both paths take as long. */
export const NO_SUCH_USER_HASH = bcrypt.hashSync('no such user, constant time', 4);
