import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationSummary } from '../../../../shared/api/collaboration';
import { api } from '../../../lib/api-client';

export const invitationsKey = (hullId: number) => ['hulls', hullId, 'invitations'] as const;

export function getInvitations(hullId: number, options: { signal?: AbortSignal } = {}): Promise<{ invitations: InvitationSummary[] }> {
  return api.get<{ invitations: InvitationSummary[] }>(`/api/hulls/${hullId}/invitations`, options);
}

export function getInvitationsQueryOptions(hullId: number) {
  return queryOptions({ queryKey: invitationsKey(hullId), queryFn: ({ signal }) => getInvitations(hullId, { signal }) });
}

/** The hull's invitations still waiting for an answer (owners only). */
export function useInvitations(hullId: number, options: { enabled?: boolean } = {}) {
  return useQuery({ ...getInvitationsQueryOptions(hullId), ...options });
}
