import bcrypt from 'bcryptjs';

export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

// Compared against when the e-mail is unknown, so both failures take the same time: made at
// the cost real hashes use (BCRYPT_COST), since bcrypt's time doubles with each step of cost.
const decoys = new Map<number, Promise<string>>();
export function decoyHash(cost: number): Promise<string> {
  let decoy = decoys.get(cost);
  if (!decoy) {
    decoy = bcrypt.hash('rackside-decoy-password', cost);
    decoys.set(cost, decoy);
  }
  return decoy;
}

export async function burnComparison(password: string, cost: number): Promise<void> {
  await bcrypt.compare(password, await decoyHash(cost));
}
