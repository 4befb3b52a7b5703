import type { PublicUser, RegisterInput } from '@shared/auth-schemas';
import { api } from '../../../lib/api-client';
import { useStartSession } from './start-session';

/** Creates a grower account; the server signs the new grower in (201). */
export function register(input: RegisterInput): Promise<PublicUser> {
  return api.post<PublicUser>('/api/auth/register', input);
}

export const useRegister = () => useStartSession(register);
