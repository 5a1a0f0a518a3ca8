import argon2 from 'argon2';

/** argon2id hash of a password, in the PHC string format (salt and parameters included). */
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
}

/** True when the password matches the stored hash; a malformed hash counts as no match. */
export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(passwordHash, password);
  } catch {
    // argon2 throws on a hash it cannot parse; for sign-in that is simply a wrong password.
    return false;
  }
}
