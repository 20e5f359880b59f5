import type { Plan } from '../../../../shared/geometry/plan-schema';
import { draggedPartOutlines, livePartCache } from './live-part';

/**
 * The part at a dragged station worked out off the page's thread: building the whole hull again and the
 * part from it takes tens of milliseconds on a large hull, several frames the drag would otherwise drop.
 * One cache for the worker's life, so the same input comes back without computing.
 */
export interface LivePartAsk {
  id: number;
  plan: Plan;
  stationId: string;
}

const scope = globalThis as unknown as { onmessage: ((event: MessageEvent<LivePartAsk>) => void) | null; postMessage: (message: unknown) => void };
const compute = livePartCache();

scope.onmessage = (event) => {
  const { id, plan, stationId } = event.data;
  scope.postMessage({ id, outlines: draggedPartOutlines(plan, stationId, compute) });
};
