import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BuildPhoto, BuildStage } from '../../../../shared/api/build-log';
import { api } from '../../../lib/api-client';

export interface UploadPhotosInput {
  partId: string;
  stage: BuildStage | null;
  files: readonly File[];
}

/** Attach photos to a part (and the stage it is at); the server checks and re-encodes them. */
export function uploadBuildPhotos(hullId: number, input: UploadPhotosInput): Promise<{ photos: BuildPhoto[] }> {
  const form = new FormData();
  form.append('stage', input.stage ?? '');
  for (const file of input.files) form.append('photo', file, file.name);
  return api.postForm<{ photos: BuildPhoto[] }>(`/api/hulls/${hullId}/build-log/parts/${encodeURIComponent(input.partId)}/photos`, form);
}

export function useUploadBuildPhotos(hullId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UploadPhotosInput) => uploadBuildPhotos(hullId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['hulls', hullId, 'build-log'] }),
  });
}

/** Where the browser loads a photo (the session cookie goes with it; only the crew get it). */
export function photoUrl(hullId: number, photoId: number, size: 'full' | 'thumb'): string {
  return `/api/hulls/${hullId}/build-log/photos/${photoId}${size === 'thumb' ? '?size=thumb' : ''}`;
}
