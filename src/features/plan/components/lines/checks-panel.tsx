import { CircleAlert, CircleCheck, Hourglass, TriangleAlert } from 'lucide-react';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import type { CellField, PendingCell } from '../../editor/types';
import { deviationWords } from '../../format';
import type { LinesCheck } from '../../hooks/use-lines-check';
import { useEditor } from '../../hooks/use-plan-editor';
import { messageId } from './grid-rows';

function splitKey(key: string): { stationId: string; field: CellField } {
  const at = key.lastIndexOf(':');
  return { stationId: key.slice(0, at), field: key.slice(at + 1) as CellField };
}

/** Cells whose text is not in the plan: the reason for each, which the cell itself points to (aria-describedby). */
function PendingList() {
  const pending = useEditor((s) => s.pending);
  const entries = Object.entries(pending).flatMap(([lineId, row]) => Object.entries(row).map(([key, cell]) => ({ lineId, ...splitKey(key), cell: cell as PendingCell })));
  if (entries.length === 0) return null;
  const errors = entries.filter((e) => e.cell.kind === 'error').length;
  return (
    <section aria-labelledby="pending-heading" className="flex flex-col gap-2 rounded-xl border-2 border-danger bg-danger-soft p-4">
      <h3 id="pending-heading" className="text-lg font-bold text-danger-strong">
        {entries.length === 1 ? 'One cell is' : `${entries.length} cells are`} not in the plan yet
      </h3>
      <p>
        {errors > 0 ? 'A value that cannot be read as a length stays as you typed it and is left out of the plan until you correct it. ' : ''}
        A sheer, chine or keel point goes in once both its height and its half-breadth are filled in.
      </p>
      <ul className="flex flex-col gap-1">
        {entries.map(({ lineId, stationId, field, cell }) => (
          <li key={`${lineId}:${stationId}:${field}`} id={messageId('cell-msg', lineId, stationId, field)} className="flex items-start gap-2">
            {cell.kind === 'error' ? <CircleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-danger" /> : <Hourglass aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-caution" />}
            <span>{cell.message}</span>
          </li>
        ))}
      </ul>
    </section>
  );
}

/** The hull check and the fairness check, in plain words, under the table. */
export function ChecksPanel({ check, notation }: { check: LinesCheck; notation: Notation }) {
  const emptyTable = check.issues.length === 1 && check.issues[0]?.code === 'empty-table';
  const cellFlags = [...check.cellFlags.entries()].flatMap(([lineId, flags]) => [...flags.entries()].map(([key, flag]) => ({ lineId, ...splitKey(key), flag })));
  return (
    <div className="flex flex-col gap-4">
      <PendingList />
      {check.lines && !emptyTable && check.issues.length > 0 && (
        <section aria-labelledby="hull-issues-heading" className="flex flex-col gap-2 rounded-xl border-2 border-danger bg-surface p-4">
          <h3 id="hull-issues-heading" className="flex items-center gap-2 text-lg font-bold text-danger-strong">
            <CircleAlert aria-hidden="true" className="size-6" />
            The hull cannot be built from this table yet
          </h3>
          <p>Until these are put right there are no sections, no fairness check and no frames from these lines:</p>
          <ul className="list-disc pl-6">
            {check.issues.map((issue, i) => (
              <li key={`${issue.code}-${i}`}>{issue.message}</li>
            ))}
          </ul>
        </section>
      )}
      {check.lines && check.issues.length === 0 && (
        <section aria-labelledby="fairness-heading" className={`flex flex-col gap-2 rounded-xl border-2 bg-surface p-4 ${cellFlags.length + check.lineFlags.length ? 'border-caution' : 'border-ok'}`}>
          <h3 id="fairness-heading" className="flex items-center gap-2 text-lg font-bold">
            {cellFlags.length + check.lineFlags.length ? <TriangleAlert aria-hidden="true" className="size-6 text-caution" /> : <CircleCheck aria-hidden="true" className="size-6 text-ok" />}
            Fairness check
          </h3>
          {cellFlags.length + check.lineFlags.length === 0 ? (
            <p>Every line runs fair through its offsets.</p>
          ) : (
            <>
              <p>An offset that stands off its line is usually a misread figure: check it against the designer's table.</p>
              <ul className="flex flex-col gap-1">
                {cellFlags.map(({ lineId, stationId, field, flag }) => (
                  <li key={`${lineId}:${stationId}:${field}`} id={messageId('cell-flag', lineId, stationId, field)} className="flex items-start gap-2">
                    <TriangleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-caution" />
                    <span>
                      <span className="font-mono font-semibold">{deviationWords(flag.deviationMm, notation)}</span> {flag.message}
                    </span>
                  </li>
                ))}
                {check.lineFlags.map((flag, i) => (
                  <li key={`line-${flag.lineId}-${i}`} className="flex items-start gap-2">
                    <TriangleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-caution" />
                    <span>{flag.message}</span>
                  </li>
                ))}
              </ul>
            </>
          )}
        </section>
      )}
    </div>
  );
}
