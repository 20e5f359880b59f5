import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BuildEvent, BuildEventInput } from '../../../../shared/api/build-log';
import { api } from '../../../lib/api-client';

/** Mark a stage done, or reopen it (a new event either way). */
export function addBuildEvent(hullId: number, input: BuildEventInput): Promise<{ event: BuildEvent }> {
  return api.post<{ event: BuildEvent }>(`/api/hulls/${hullId}/build-log/events`, input);
}

export function useAddBuildEvent(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: BuildEventInput) => addBuildEvent(hullId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['hulls', hullId, 'build-log'] }),
  });
}
