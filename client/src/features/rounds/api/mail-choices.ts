// A mentor's mail choices, each on its own route: the urgent-case mail (off unless asked for)
// and the mail about a grower's post left unread on a case they hold (on unless turned off).
// The watchers on the server read them.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { roundsKeys } from './rounds-keys';

export type MailChoice = 'urgent-mail' | 'grower-wrote-mail';

interface Choice {
  on: boolean;
}

const path = (choice: MailChoice) => `/api/cases/preferences/${choice}`;

export function useMailChoice(choice: MailChoice) {
  return useQuery({ queryKey: roundsKeys.mailChoice(choice), queryFn: () => api.get<Choice>(path(choice)) });
}

export function useSetMailChoice(choice: MailChoice) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (on: boolean) => api.patch<Choice>(path(choice), { on }),
    onSuccess: (answer) => queryClient.setQueryData(roundsKeys.mailChoice(choice), answer),
  });
}
