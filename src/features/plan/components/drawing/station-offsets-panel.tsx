import { useId, useState, type KeyboardEvent } from 'react';
import { ChevronLeft, ChevronRight, CircleAlert, Crosshair, Trash2 } from 'lucide-react';
import type { Line } from '../../../../../shared/geometry/hull-schema';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { lengthFormat, lengthParse } from '../../../../../shared/geometry/notation';
import type { Section } from '../../../../../shared/geometry/section';
import { Button } from '../../../../components/ui/button';
import { cellSet } from '../../editor/cell-actions';
import { cellLabel, cellText, pendingOf } from '../../editor/cell-entry';
import { offsetDelete } from '../../editor/offset-actions';
import { stationMove } from '../../editor/station-actions';
import { edit, type CellField } from '../../editor/types';
import { useEditor, usePlanEditor } from '../../hooks/use-plan-editor';
import { OFFSET_MEASURE_WORDS, offsetOnSection, stationsInOrder } from '../../drawing/body-plan';
import { lengthInputMode } from '../../length-field';
import type { OffsetSelection } from './body-plan-view';

const inputClass = 'min-h-12 w-full min-w-0 rounded-lg border-2 bg-surface px-2 font-mono text-base read-only:bg-paper';

/**
 * A length typed in the notation and put into the plan on Enter or when the field is left; Escape puts
 * it back. Remounted (by its key) whenever the value it shows changes elsewhere: a drag, an undo.
 */
function LengthInput({ label, text, invalid, describedBy, readOnly, notation, onCommit, onFocus }: {
  label: string;
  text: string;
  invalid: boolean;
  describedBy?: string;
  readOnly: boolean;
  notation: Notation;
  onCommit: (text: string) => void;
  onFocus?: () => void;
}) {
  const [draft, setDraft] = useState(text);
  const commit = () => {
    if (draft.trim() !== text.trim()) onCommit(draft);
  };
  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === 'Enter') commit();
    if (e.key === 'Escape') setDraft(text);
  };
  return (
    <input
      aria-label={label}
      value={draft}
      readOnly={readOnly}
      inputMode={lengthInputMode(notation)}
      aria-invalid={invalid || undefined}
      aria-describedby={describedBy}
      className={`${inputClass} ${invalid ? 'border-danger' : 'border-edge'}`}
      onChange={(e) => setDraft(e.target.value)}
      onBlur={commit}
      onKeyDown={onKeyDown}
      onFocus={onFocus}
    />
  );
}

/**
 * The chosen station's offsets beside the body plan: the same cells as the table of offsets, typed the
 * same way (so an exact value for a dragged point is typed here), with a way to clear a point, to put a
 * missing one where its line crosses the section, and to move the station along the hull.
 */
export function StationOffsetsPanel({ selection, onSelect, section, readOnly, notation }: {
  selection: OffsetSelection;
  onSelect: (selection: OffsetSelection) => void;
  section: Section | null;
  readOnly: boolean;
  notation: Notation;
}) {
  const { store } = usePlanEditor();
  const lines = useEditor((s) => s.plan.lines);
  const pending = useEditor((s) => s.pending);
  const [xError, setXError] = useState<string | null>(null);
  const xErrorId = useId();
  const stations = stationsInOrder(lines.stations);
  const index = stations.findIndex((s) => s.id === selection.stationId);
  const station = stations[index];
  if (!station) return null;
  const apply = store.getState().apply;

  const enter = (line: Line, field: CellField, text: string) => {
    store.getState().enterCells([{ ref: { lineId: line.id, stationId: station.id, field }, text }], notation, cellLabel(line, field, station));
  };
  const moveStation = (text: string) => {
    const parsed = lengthParse(text, notation);
    if (!parsed) return setXError(`Station ${station.name} x: a station needs its place along the hull; it stays at ${lengthFormat(station.x, notation)}.`);
    if (!parsed.ok) return setXError(`Station ${station.name} x, "${text.trim()}": ${parsed.message}`);
    if (lines.stations.some((s) => s.id !== station.id && s.x === parsed.mm)) {
      return setXError(`Station ${station.name} x, "${text.trim()}": another station is already at ${lengthFormat(parsed.mm, notation)}.`);
    }
    setXError(null);
    apply(edit(`Move ${station.name} to x ${lengthFormat(parsed.mm, notation)}`, stationMove, { stationId: station.id, x: parsed.mm }));
  };
  const go = (to: number) => {
    const next = stations[to];
    if (next) onSelect({ stationId: next.id, lineId: null });
  };

  return (
    <section aria-labelledby="station-offsets-heading" className="flex flex-col gap-3 rounded-xl border-2 border-edge bg-surface p-4" data-testid="station-offsets">
      <div className="flex items-center justify-between gap-2">
        <Button variant="secondary" aria-label="Previous station" disabled={index <= 0} onClick={() => go(index - 1)}>
          <ChevronLeft aria-hidden="true" className="size-5" />
        </Button>
        <h3 id="station-offsets-heading" className="text-xl font-bold">
          Station {station.name}
        </h3>
        <Button variant="secondary" aria-label="Next station" disabled={index >= stations.length - 1} onClick={() => go(index + 1)}>
          <ChevronRight aria-hidden="true" className="size-5" />
        </Button>
      </div>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Station x (along the hull)</span>
        <LengthInput
          key={`${station.id}:${station.x}`}
          label={`${station.name} x`}
          text={lengthFormat(station.x, notation)}
          invalid={!!xError}
          describedBy={xError ? xErrorId : undefined}
          readOnly={readOnly}
          notation={notation}
          onCommit={moveStation}
        />
      </label>
      {xError && (
        <p id={xErrorId} className="flex items-start gap-1.5 font-medium text-danger">
          <CircleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
          {xError}
        </p>
      )}
      {/* A hull of fifty lines makes a long table: it scrolls beside the drawing rather than lengthening the page. */}
      <div className="max-h-[70vh] overflow-y-auto">
        <table className="w-full border-collapse text-base">
          <caption className="sr-only">Offsets at station {station.name}</caption>
          <thead>
            <tr className="border-b-2 border-edge text-left">
              <th scope="col" className="py-1 pr-2">Line</th>
              <th scope="col" className="py-1 pr-2">Offset</th>
              {!readOnly && <th scope="col" className="py-1"><span className="sr-only">Change</span></th>}
            </tr>
          </thead>
          <tbody>
            {lines.lines.map((line) => {
              const fields: CellField[] = line.kind === 'point' ? ['y', 'z'] : ['value'];
              const chosen = selection.lineId === line.id;
              const empty = (line.cells as Record<string, unknown>)[station.id] == null;
              const crossing = empty && section ? offsetOnSection(line, section) : null;
              const messages = fields.map((f) => pendingOf(pending, { lineId: line.id, stationId: station.id, field: f })).filter((p) => p !== undefined);
              return (
                <tr key={line.id} className={`border-b border-rule align-top ${chosen ? 'bg-primary-soft' : ''}`} data-line-id={line.id}>
                  <th scope="row" className="py-1 pr-2 text-left font-semibold">
                    {line.name}
                    {OFFSET_MEASURE_WORDS[line.kind] && <span className="block text-sm font-normal text-muted">{OFFSET_MEASURE_WORDS[line.kind]}</span>}
                  </th>
                  <td className="py-1 pr-2">
                    <div className={line.kind === 'point' ? 'grid grid-cols-2 gap-1' : ''}>
                      {fields.map((f) => {
                        const ref = { lineId: line.id, stationId: station.id, field: f };
                        const waiting = pendingOf(pending, ref);
                        const text = waiting?.text ?? cellText(line, station.id, f, notation);
                        return (
                          <LengthInput
                            key={`${f}:${text}`}
                            label={cellLabel(line, f, station)}
                            text={text}
                            invalid={waiting?.kind === 'error'}
                            readOnly={readOnly}
                            notation={notation}
                            onCommit={(t) => enter(line, f, t)}
                            onFocus={() => onSelect({ stationId: station.id, lineId: line.id })}
                          />
                        );
                      })}
                    </div>
                    {messages.map((m) => (
                      <p key={m.message} className={`text-sm ${m.kind === 'error' ? 'text-danger' : 'text-caution'}`}>{m.message}</p>
                    ))}
                  </td>
                  {!readOnly && (
                    <td className="py-1">
                      {!empty ? (
                        <Button variant="secondary" className="px-3" aria-label={`Delete ${line.name} at ${station.name}`} onClick={() => apply(edit(`Delete ${line.name} at ${station.name}`, offsetDelete, { lineId: line.id, stationId: station.id }))}>
                          <Trash2 aria-hidden="true" className="size-5" />
                        </Button>
                      ) : crossing !== null ? (
                        <Button
                          variant="secondary"
                          className="px-3"
                          aria-label={`Add ${line.name} at ${station.name} where it crosses the section`}
                          title="Add the point where this line crosses the section"
                          onClick={() => apply(edit(`Add ${line.name} at ${station.name}`, cellSet, { lineId: line.id, stationId: station.id, value: crossing }))}
                        >
                          <Crosshair aria-hidden="true" className="size-5" />
                        </Button>
                      ) : null}
                    </td>
                  )}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {!readOnly && <p className="text-sm text-muted">Type an exact value and press Enter. An empty cell adds a point when you type into it, or with the cross-hair where its line crosses this section.</p>}
    </section>
  );
}
