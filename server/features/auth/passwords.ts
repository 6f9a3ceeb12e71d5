import bcrypt from 'bcryptjs';

export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

// Compared against when the e-mail is unknown, so both failures take the same time.
const decoy = bcrypt.hashSync('rackside-decoy-password', 10);
export async function burnComparison(password: string): Promise<void> {
  await bcrypt.compare(password, decoy);
}
