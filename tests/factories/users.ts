// Each test makes its own people. Passwords are hashed for real (argon2id), once per password.
import crypto from 'node:crypto';
import type { Role } from '../../server/shared/case-status';
import { hashPassword } from '../../server/src/modules/auth/passwords';
import { usersRepository, type UserRecord } from '../../server/src/modules/users/users.repository';

export const FACTORY_PASSWORD = 'a-long-enough-test-password';
const hashes = new Map<string, Promise<string>>();

export function uniqueEmail(prefix = 'user'): string {
  return `${prefix}-${crypto.randomBytes(5).toString('hex')}@example.test`;
}

export async function createUser(options: { role?: Role; email?: string; password?: string; displayName?: string; disabled?: boolean } = {}): Promise<UserRecord & { password: string }> {
  const password = options.password ?? FACTORY_PASSWORD;
  if (!hashes.has(password)) hashes.set(password, hashPassword(password));
  const user = await usersRepository.create({
    email: options.email ?? uniqueEmail(options.role ?? 'grower'),
    displayName: options.displayName ?? `Test ${options.role ?? 'grower'}`,
    passwordHash: await hashes.get(password)!,
    role: options.role ?? 'grower',
    emailVerified: true,
  });
  if (options.disabled) await usersRepository.update(user.id, { disabled: true });
  return { ...user, password };
}
