// argon2id at the OWASP minimum (m = 19 MiB, t = 2, p = 1) or stronger (ASVS 11.4.2), and a
// refusal of passwords from the common-password lists (ASVS 6.2.4).
import argon2 from 'argon2';
import { COMMON_PASSWORDS } from './common-passwords';

let memoryCost = 19456;
export function setArgonMemory(kib: number): void {
  memoryCost = Math.max(19456, kib);
}

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id, memoryCost, timeCost: 2, parallelism: 1 });
}

export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

// A fixed hash to verify against when the e-mail is unknown, so both answers take as long.
let dummyHash: Promise<string> | null = null;
export async function burnTime(password: string): Promise<void> {
  dummyHash ??= hashPassword('not-a-real-account-password');
  await verifyPassword(await dummyHash, password);
}

export function isCommonPassword(password: string): boolean {
  const lowered = password.toLowerCase();
  if (COMMON_PASSWORDS.has(lowered)) return true;
  // One character repeated, or a plain run of digits, is as weak as the list.
  if (/^(.)\1+$/.test(lowered)) return true;
  if (/^(0123456789|1234567890|9876543210)+\d*$/.test(lowered)) return true;
  return false;
}
