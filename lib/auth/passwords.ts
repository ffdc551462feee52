// Password hashes: bcrypt (bcryptjs). New hashes use cost 12 (OWASP Password Storage Cheat Sheet:
// bcrypt work factor 10 or more; 12 is our choice, ~0.3 s here). Every hash has its own random
// salt (bcrypt.hash draws one each call). The demo seed alone uses SEED_PASSWORD_COST (README:
// "Demo accounts") so `npm test` stays quick; such a hash is upgraded at its first sign-in.
import bcrypt from "bcryptjs";

export const PASSWORD_COST = 12;
export const SEED_PASSWORD_COST = 10;

export function hashPassword(password: string, cost = PASSWORD_COST): Promise<string> {
  return bcrypt.hash(password, cost);
}

/** The cost a bcrypt hash was made with ("$2b$12$…" → 12), or null for anything else. */
export function hashCost(hash: string): number | null {
  const match = /^\$2[abxy]\$(\d{2})\$/.exec(hash);
  return match ? Number(match[1]) : null;
}

export function needsRehash(hash: string): boolean {
  const cost = hashCost(hash);
  return cost === null || cost < PASSWORD_COST;
}

let decoy: Promise<string> | null = null;
/**
 * Compared against when the e-mail is unknown, so a wrong address costs as long as a wrong
 * password: a hash of a random string at PASSWORD_COST, made once per process.
 */
export function decoyHash(): Promise<string> {
  decoy ??= hashPassword(crypto.randomUUID());
  return decoy;
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}
