import bcrypt from 'bcryptjs';

export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

export function passwordMatches(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

// Compared against when no account has the address, so an unknown address costs as long as a
// wrong password and the timing does not tell them apart.
const standInHashes = new Map<number, Promise<string>>();
export function standInHash(cost: number): Promise<string> {
  let h = standInHashes.get(cost);
  if (!h) {
    h = bcrypt.hash('no account has this address', cost);
    standInHashes.set(cost, h);
  }
  return h;
}
