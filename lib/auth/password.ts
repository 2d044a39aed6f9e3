import bcrypt from 'bcryptjs';

const COST = 10;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string | null | undefined): Promise<boolean> {
  // Compare against a fixed hash when the account has none, so timing does not reveal it.
  return bcrypt.compare(plain, hash ?? '$2b$10$CwTycUXWue0Thq9StjUM0uJ8.J5Xh7YQqJ1g4y2F1rEJmQ9zG2Fyu');
}
