import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { getNoticesQueryOptions } from './get-notices';

export function dismissNotice(noticeId: number): Promise<void> {
  return api.post<void>(`/api/notices/${noticeId}/dismiss`);
}

/** Stay on the pinned revision: the notice goes away until something newer is published. */
export function useDismissNotice() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: dismissNotice,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getNoticesQueryOptions().queryKey }),
  });
}
