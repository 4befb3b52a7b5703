import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PublicUser } from '@shared/auth-schemas';
import { authKeys, isPerUserQuery } from './auth-keys';

/** A mutation that ends with someone signed in (sign-in, join): the session cache is set from
 * the answer, and per-user data is refetched before the caller moves on. */
export function useStartSession<Input>(mutationFn: (input: Input) => Promise<PublicUser>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: async (user) => {
      queryClient.setQueryData(authKeys.me(), user);
      await queryClient.invalidateQueries({ predicate: isPerUserQuery });
    },
  });
}
