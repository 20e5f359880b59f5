import { useEffect, useState, type KeyboardEvent } from 'react';
import { CircleAlert, Plus, Trash2 } from 'lucide-react';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { lengthFormat } from '../../../../../shared/geometry/notation';
import type { MeasuredFrame } from '../../../../../shared/geometry/part-schema';
import type { Plan } from '../../../../../shared/geometry/plan-schema';
import { radToDeg } from '../../../../../shared/geometry/types';
import { Button } from '../../../../components/ui/button';
import { InputField, SelectField } from '../../../../components/ui/field';
import { measuredEntry, measuredPointDelete, type MeasuredField, type MeasuredReading, type MeasuredTexts } from '../../editor/measured-actions';
import type { Edit } from '../../editor/types';
import { lengthInputMode } from '../../length-field';

export interface MeasuredPointsTableProps {
  frame: MeasuredFrame;
  /** The working copy, so an entry is read against what the plan holds now. */
  plan: Plan;
  notation: Notation;
  readOnly: boolean;
  /** The editor store's `apply`: every change goes through it (and its undo). */
  apply: (edit: Edit) => boolean;
  /** A point was added from the table's form. */
  onAdded?: () => void;
}

type Errors = Partial<Record<MeasuredField, string>>;

const unitOf = (n: Notation): string => (n.unit === 'mm' ? 'mm' : 'in');
const degText = (rad: number): string => String(Number(radToDeg(rad).toFixed(2)));

/** The text a reading's field shows. */
function shownText(reading: MeasuredReading, field: MeasuredField, notation: Notation): string {
  switch (field) {
    case 'y':
      return 'y' in reading ? lengthFormat(reading.y, notation) : '';
    case 'h':
      return 'h' in reading ? lengthFormat(reading.h, notation) : '';
    case 'side':
      return 'side' in reading ? reading.side : '';
    case 'angle':
      return 'angleRad' in reading ? degText(reading.angleRad) : '';
    case 'distance':
      return 'distanceMm' in reading ? lengthFormat(reading.distanceMm, notation) : '';
    case 'bevel':
      return reading.bevel ? degText(reading.bevel.readingRad) : '';
    case 'sense':
      return reading.bevel?.sense ?? '';
  }
}

function fieldsOf(frame: MeasuredFrame): { field: MeasuredField; words: string; length: boolean }[] {
  const bevel = [{ field: 'bevel' as const, words: 'Bevel reading (°)', length: false }];
  return frame.measurement.kind === 'offsets'
    ? [{ field: 'y', words: 'Offset from centreline', length: true }, { field: 'h', words: 'Height above reference', length: true }, ...bevel]
    : [{ field: 'side', words: 'Side', length: false }, { field: 'angle', words: 'Angle below horizontal (°)', length: false }, { field: 'distance', words: 'Distance', length: true }, ...bevel];
}

function ReadingRow({ frame, index, reading, notation, readOnly, commit, remove }: { frame: MeasuredFrame; index: number; reading: MeasuredReading; notation: Notation; readOnly: boolean; commit: (index: number, texts: MeasuredTexts) => Errors | null; remove: (index: number) => void }) {
  const [texts, setTexts] = useState<MeasuredTexts>({});
  const [errors, setErrors] = useState<Errors>({});
  // When the reading itself changes (undo, the drawing, this row's own entry) what was typed in it is done with.
  // The row is not remounted for it, so the field the person tabbed into keeps the focus.
  const readingKey = JSON.stringify(reading);
  useEffect(() => {
    setTexts({});
    setErrors({});
  }, [readingKey]);
  const n = index + 1;
  const errorId = `measured-row-${frame.id}-${index}-error`;
  const send = (more: MeasuredTexts = {}) => {
    const all = { ...texts, ...more };
    if (Object.keys(all).length === 0) return;
    const failed = commit(index, all);
    if (failed) {
      setTexts(all);
      setErrors(failed);
    } else {
      setTexts({});
      setErrors({});
    }
  };
  const onKey = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === 'Enter') send();
    if (e.key === 'Escape') {
      setTexts({});
      setErrors({});
    }
  };
  const messages = Object.values(errors).filter(Boolean);
  const unit = unitOf(notation);
  return (
    <>
      <tr className="border-t border-rule">
        <th scope="row" className="px-2 py-1 text-center font-mono">
          {n}
        </th>
        {fieldsOf(frame).map(({ field, words, length }) => {
          const label = `Point ${n} ${words.toLowerCase()}${length ? ` (${unit})` : ''}`;
          const value = texts[field] ?? shownText(reading, field, notation);
          const bad = errors[field] ? true : undefined;
          if (field === 'side') {
            return (
              <td key={field} className="px-1 py-1">
                <select aria-label={label} disabled={readOnly} value={value} onChange={(e) => send({ side: e.target.value })} className="min-h-12 rounded-lg border-2 border-edge bg-surface px-2">
                  <option value="port">Port</option>
                  <option value="starboard">Starboard</option>
                </select>
              </td>
            );
          }
          return (
            <td key={field} className="px-1 py-1">
              <div className="flex items-center gap-1">
                <input
                  aria-label={label}
                  aria-invalid={bad}
                  aria-describedby={bad ? errorId : undefined}
                  readOnly={readOnly}
                  inputMode={length ? lengthInputMode(notation) : 'decimal'}
                  value={value}
                  onChange={(e) => setTexts((t) => ({ ...t, [field]: e.target.value }))}
                  onBlur={() => send()}
                  onKeyDown={onKey}
                  className={`min-h-12 w-20 rounded-lg border-2 bg-surface px-2 font-mono ${bad ? 'border-danger bg-danger-soft' : 'border-edge'}`}
                />
                {field === 'bevel' && (
                  <select
                    aria-label={`Point ${n} bevel sense`}
                    disabled={readOnly || !(texts.bevel ?? shownText(reading, 'bevel', notation))}
                    value={texts.sense ?? reading.bevel?.sense ?? 'under'}
                    onChange={(e) => send({ sense: e.target.value })}
                    aria-invalid={errors.sense ? true : undefined}
                    aria-describedby={errors.sense ? errorId : undefined}
                    className={`min-h-12 rounded-lg border-2 bg-surface px-1 ${errors.sense ? 'border-danger' : 'border-edge'}`}
                  >
                    <option value="under">under</option>
                    <option value="standing">standing</option>
                  </select>
                )}
              </div>
            </td>
          );
        })}
        {!readOnly && (
          <td className="px-1 py-1">
            <Button variant="quiet" aria-label={`Delete point ${n}`} onClick={() => remove(index)} className="px-2">
              <Trash2 aria-hidden="true" className="size-5" />
            </Button>
          </td>
        )}
      </tr>
      {messages.length > 0 && (
        <tr>
          <td colSpan={8} id={errorId} className="px-2 pb-2 text-danger">
            {messages.map((m) => (
              <p key={m} className="flex items-start gap-1.5 font-medium">
                <CircleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
                {m} Nothing was changed.
              </p>
            ))}
          </td>
        </tr>
      )}
    </>
  );
}

function AddReading({ frame, notation, commit }: { frame: MeasuredFrame; notation: Notation; commit: (index: number, texts: MeasuredTexts) => Errors | null }) {
  const [texts, setTexts] = useState<MeasuredTexts>(frame.measurement.kind === 'angle-distance' ? { side: 'starboard' } : {});
  const [errors, setErrors] = useState<Errors>({});
  const unit = unitOf(notation);
  const add = () => {
    const failed = commit(frame.measurement.points.length, texts);
    if (failed) setErrors(failed);
    else {
      setTexts(frame.measurement.kind === 'angle-distance' ? { side: texts.side } : {});
      setErrors({});
    }
  };
  return (
    <form
      aria-label="Add a point"
      className="flex flex-wrap items-start gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        add();
      }}
    >
      {fieldsOf(frame).map(({ field, words, length }) =>
        field === 'side' ? (
          <div key={field} className="w-36">
            <SelectField label="Side" value={texts.side ?? 'starboard'} onChange={(e) => setTexts((t) => ({ ...t, side: e.target.value }))}>
              <option value="port">Port</option>
              <option value="starboard">Starboard</option>
            </SelectField>
          </div>
        ) : (
          <div key={field} className="w-44">
            <InputField
              label={`${words}${length ? ` (${unit})` : ''}`}
              inputMode={length ? lengthInputMode(notation) : 'decimal'}
              value={texts[field] ?? ''}
              error={errors[field]}
              onChange={(e) => setTexts((t) => ({ ...t, [field]: e.target.value }))}
              className="font-mono"
              hint={field === 'bevel' ? 'Optional; under 90° is an under bevel' : undefined}
            />
          </div>
        ),
      )}
      {errors.sense && <p className="w-full font-medium text-danger">{errors.sense}</p>}
      <Button type="submit" className="mt-8">
        <Plus aria-hidden="true" className="size-5" />
        Add point
      </Button>
    </form>
  );
}

/**
 * The measured frame's readings as a table beside the drawing: type a point's offsets (or angle and
 * distance) and bevel reading; a value that cannot be read is marked with its reason and nothing is
 * written. Every change goes through the editor's `apply`, so it is undone like any other.
 */
export function MeasuredPointsTable({ frame, plan, notation, readOnly, apply, onAdded }: MeasuredPointsTableProps) {
  const points = frame.measurement.points as MeasuredReading[];
  const commit = (index: number, texts: MeasuredTexts): Errors | null => {
    const entry = measuredEntry(plan, { partId: frame.id, index, texts }, notation);
    if (!entry.ok) return entry.errors;
    const label = index >= points.length ? `Add point ${index + 1} to ${frame.name}` : `Change point ${index + 1} of ${frame.name}`;
    // Read again against the plan the store holds when it applies, so nothing typed meanwhile is lost.
    const again = (current: Plan): Plan => {
      const read = measuredEntry(current, { partId: frame.id, index, texts }, notation);
      return read.ok ? read.plan : current;
    };
    apply({ label, apply: again });
    if (index >= points.length) onAdded?.();
    return null;
  };
  const remove = (index: number) => apply({ label: `Delete point ${index + 1} of ${frame.name}`, apply: (p) => measuredPointDelete(p, { partId: frame.id, index }) });
  const unit = unitOf(notation);
  return (
    <div className="flex flex-col gap-3">
      <div className="overflow-x-auto rounded-xl border border-rule bg-surface" role="region" aria-label="Measured points" tabIndex={0}>
        <table className="min-w-full border-collapse text-left">
          <caption className="sr-only">Measured points of {frame.name}, in order along the edge</caption>
          <thead className="bg-paper text-sm">
            <tr>
              <th scope="col" className="px-2 py-2">
                No.
              </th>
              {fieldsOf(frame).map(({ field, words, length }) => (
                <th key={field} scope="col" className="px-2 py-2">
                  {words}
                  {length ? ` (${unit})` : ''}
                </th>
              ))}
              {!readOnly && (
                <th scope="col" className="px-2 py-2">
                  <span className="sr-only">Delete</span>
                </th>
              )}
            </tr>
          </thead>
          <tbody>
            {points.length === 0 && (
              <tr>
                <td colSpan={8} className="px-3 py-3 text-muted">
                  No points yet.{readOnly ? '' : ' Type them below, or turn on “Add points by clicking” and click on the drawing.'}
                </td>
              </tr>
            )}
            {points.map((reading, i) => (
              <ReadingRow key={i} frame={frame} index={i} reading={reading} notation={notation} readOnly={readOnly} commit={commit} remove={remove} />
            ))}
          </tbody>
        </table>
      </div>
      {!readOnly && <AddReading key={`${frame.id}:${frame.measurement.kind}`} frame={frame} notation={notation} commit={commit} />}
    </div>
  );
}
