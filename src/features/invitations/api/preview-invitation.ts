import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationPreview } from '../../../../shared/api/collaboration';
import { api } from '../../../lib/api-client';

/** POST, not GET: the token stays out of URLs, and so out of logs. */
export function previewInvitation(token: string): Promise<{ invitation: InvitationPreview }> {
  return api.post<{ invitation: InvitationPreview }>('/api/invitations/preview', { token });
}

export function previewInvitationQueryOptions(token: string) {
  return queryOptions({ queryKey: ['invitations', 'preview', token], queryFn: () => previewInvitation(token), staleTime: Infinity });
}

/** What the link from the mail is an invitation to. */
export function useInvitationPreview(token: string) {
  return useQuery(previewInvitationQueryOptions(token));
}
