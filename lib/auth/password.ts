import bcrypt from "bcryptjs";

// bcrypt work factor for every stored password (OWASP asks for at least 10).
export const BCRYPT_COST = 10;

export function hashPassword(plain: string): string {
  return bcrypt.hashSync(plain, BCRYPT_COST);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}
