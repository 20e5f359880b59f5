import { useEffect, useRef, useState } from 'react';
import type { HullLines } from '../../../../shared/geometry/hull-schema';
import { emptyCheck, linesCheck, type LinesCheck } from '../editor/lines-check';

export type { CellFlag, LinesCheck } from '../editor/lines-check';

/** Time after the last edit before the check runs again, so a burst of typing asks for one check. */
export const LINES_CHECK_DELAY_MS = 400;

type Reply = { id: number; result: Omit<LinesCheck, 'lines'> };

/** A worker for the checks where the browser has them; null where it has not (the component tests' DOM). */
function startWorker(): Worker | null {
  if (typeof Worker === 'undefined') return null;
  try {
    return new Worker(new URL('../editor/lines-check.worker.ts', import.meta.url), { type: 'module' });
  } catch {
    return null;
  }
}

/**
 * The hull check and fairness check of the working copy's lines, run a moment after they stop changing,
 * in a worker so the table stays quick to type in. Only the answer for the latest lines is kept.
 */
export function useLinesCheck(lines: HullLines): LinesCheck {
  const [result, setResult] = useState<LinesCheck>(emptyCheck);
  const worker = useRef<Worker | null | undefined>(undefined);
  const asked = useRef(new Map<number, HullLines>());
  const latest = useRef(0);

  useEffect(() => {
    const w = startWorker();
    worker.current = w;
    if (!w) return undefined;
    w.onmessage = (event: MessageEvent<Reply>) => {
      const forLines = asked.current.get(event.data.id);
      asked.current.delete(event.data.id);
      if (event.data.id === latest.current && forLines) setResult({ ...event.data.result, lines: forLines });
    };
    // A worker that fails to start leaves the checks to the page's thread.
    w.onerror = () => {
      worker.current = null;
      const waiting = asked.current.get(latest.current);
      asked.current.clear();
      if (waiting) setResult(linesCheck(waiting));
    };
    return () => {
      w.terminate();
      worker.current = undefined;
    };
  }, []);

  const lastAsked = useRef<HullLines | null>(null);
  useEffect(() => {
    if (lines === lastAsked.current) return undefined;
    // The first check runs at once; later ones wait for a pause in the typing.
    const delay = lastAsked.current === null ? 0 : LINES_CHECK_DELAY_MS;
    const timer = setTimeout(
      () => {
        lastAsked.current = lines;
        const id = (latest.current += 1);
        const w = worker.current;
        if (w) {
          asked.current.set(id, lines);
          w.postMessage({ id, lines });
        } else {
          setResult(linesCheck(lines));
        }
      },
      delay,
    );
    return () => clearTimeout(timer);
  }, [lines]);
  return result;
}
