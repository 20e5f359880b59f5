import type { SaveDraftInput } from '../../../../shared/api/plan';
import { api } from '../../../lib/api-client';

/**
 * The autosave: replace the person's draft. `keepalive` lets the request finish after the tab is closed;
 * the autosave calls this directly (it queues its own requests), so there is no mutation hook.
 */
export function savePlanDraft(hullId: number, input: SaveDraftInput, options: { keepalive?: boolean } = {}): Promise<{ draft: { updatedAt: string } }> {
  return api.put<{ draft: { updatedAt: string } }>(`/api/hulls/${hullId}/plan/draft`, input, { keepalive: options.keepalive });
}
