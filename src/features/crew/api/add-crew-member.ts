import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AddMemberInput, CrewMember } from '../../../../shared/api/hulls';
import { api } from '../../../lib/api-client';
import { getCrewQueryOptions } from './get-crew';

export function addCrewMember(hullId: number, input: AddMemberInput): Promise<{ member: CrewMember }> {
  return api.post<{ member: CrewMember }>(`/api/hulls/${hullId}/crew`, input);
}

/** The owner adds an existing account, by e-mail, to the hull's crew. */
export function useAddCrewMember(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AddMemberInput) => addCrewMember(hullId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: getCrewQueryOptions(hullId).queryKey }),
  });
}
