import { useMutation, useQueryClient } from '@tanstack/react-query';
import { post } from '../lib/api-client.ts';

/** Switching company changes every answer, so the whole cache goes. */
export function useSwitchCompany() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (tenantId: string) => post<void>('/api/account/me/company', { tenantId }),
    onSuccess: () => qc.resetQueries(),
  });
}
