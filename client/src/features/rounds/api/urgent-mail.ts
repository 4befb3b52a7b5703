// A mentor's choice to be e-mailed about urgent cases nobody has taken (the urgent-case watcher
// on the server reads it).
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { roundsKeys } from './rounds-keys';

interface UrgentMail {
  on: boolean;
}

const PATH = '/api/cases/preferences/urgent-mail';

export function useUrgentMail() {
  return useQuery({ queryKey: roundsKeys.urgentMail(), queryFn: () => api.get<UrgentMail>(PATH) });
}

export function useSetUrgentMail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (on: boolean) => api.patch<UrgentMail>(PATH, { on }),
    onSuccess: (answer) => queryClient.setQueryData(roundsKeys.urgentMail(), answer),
  });
}
