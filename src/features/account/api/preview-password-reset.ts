import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export function previewPasswordReset(token: string): Promise<{ email: string }> {
  return api.post<{ email: string }>('/api/account/password-reset/preview', { token });
}

export function previewPasswordResetQueryOptions(token: string) {
  return queryOptions({ queryKey: ['password-reset', token], queryFn: () => previewPasswordReset(token), staleTime: Infinity });
}

/** Whose password the link would reset, or why it no longer works. */
export function usePasswordResetPreview(token: string) {
  return useQuery(previewPasswordResetQueryOptions(token));
}
