import type { LoginInput, PublicUser } from '@shared/auth-schemas';
import { api } from '../../../lib/api-client';
import { useStartSession } from './start-session';

export function login(input: LoginInput): Promise<PublicUser> {
  return api.post<PublicUser>('/api/auth/login', input);
}

export const useLogin = () => useStartSession(login);
