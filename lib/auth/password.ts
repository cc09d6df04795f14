/** Password hashing with bcrypt (cost 11, above the minimum of 10 the product requires). */
import bcrypt from "bcryptjs";

export const BCRYPT_COST = 11;

// Compared against when the e-mail is unknown, so that the time taken does not tell whether an
// account exists. Made once, lazily, with the same cost as real hashes.
let dummyHash: Promise<string> | undefined;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  if (!hash) {
    dummyHash ??= bcrypt.hash("no such account", BCRYPT_COST);
    await bcrypt.compare(password, await dummyHash);
    return false;
  }
  return bcrypt.compare(password, hash);
}
