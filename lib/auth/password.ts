import { hash, verify } from '@node-rs/argon2';

// The library's default is argon2id (m=19 MiB, t=2, p=1); a test checks the `$argon2id$` prefix.
// (Its Algorithm enum is a const enum, which isolatedModules cannot import.)
export async function hashPassword(password: string): Promise<string> {
  return hash(password);
}

export async function verifyPassword(stored: string, password: string): Promise<boolean> {
  try {
    return await verify(stored, password);
  } catch {
    return false;
  }
}

let dummy: Promise<string> | undefined;
/**
 * Spend the same time on an unknown e-mail as on a wrong password, so response times do not
 * tell which addresses have accounts.
 */
export async function burnPasswordCheck(password: string): Promise<void> {
  dummy ??= hashPassword('branchwise-timing-equaliser');
  await verifyPassword(await dummy, password);
}

export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 200;
