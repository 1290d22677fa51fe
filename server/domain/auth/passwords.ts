import bcrypt from 'bcryptjs';
import { PASSWORD_MAX_BYTES, passwordBytes } from '@/shared/schemas/auth';

/** bcrypt work factor; 10 is the usual floor, 12 costs ~4× more per sign-in. */
export const BCRYPT_COST = 11;

/** Refuses what bcrypt would silently cut (the schemas already say so to people). */
export function hashPassword(plain: string): Promise<string> {
  if (passwordBytes(plain) > PASSWORD_MAX_BYTES) throw new RangeError(`A password is at most ${PASSWORD_MAX_BYTES} bytes`);
  return bcrypt.hash(plain, BCRYPT_COST);
}

// Compared against when the e-mail is unknown, so both failures take as long.
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', BCRYPT_COST);

/** Constant-work comparison: a null hash still costs one bcrypt round. */
export async function verifyPassword(plain: string, hash: string | null): Promise<boolean> {
  const ok = await bcrypt.compare(plain, hash ?? DUMMY_HASH);
  return ok && hash !== null;
}
