import bcrypt from 'bcryptjs';

// bcrypt (cost 11): a well-known adaptive hash; the pure-JS build needs no install script.
const COST = 11;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}
