import type { HullLines } from '../../../../shared/geometry/hull-schema';
import { linesCheck } from './lines-check';

/**
 * The hull and fairness checks off the page's thread: on a large table (300 stations, 40 lines) they take
 * seconds, which would freeze typing. Maps and plain objects survive the trip as they are.
 */
const scope = globalThis as unknown as { onmessage: ((event: MessageEvent<{ id: number; lines: HullLines }>) => void) | null; postMessage: (message: unknown) => void };

scope.onmessage = (event) => {
  const { id, lines } = event.data;
  const { lines: _sent, ...result } = linesCheck(lines);
  scope.postMessage({ id, result });
};
