// Mail choices, each on its own route: for mentors the urgent-case mail (off unless asked for)
// and the mail about a grower's post left unread on a case they hold; for anyone with a case,
// the mail when a mentor replies while they are away (both on unless turned off).
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { roundsKeys } from './rounds-keys';

export type MailChoice = 'urgent-mail' | 'grower-wrote-mail' | 'reply-mail';

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
