import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Pencil, Plus, Trash2 } from 'lucide-react';
import type { Line } from '../../../../../shared/geometry/hull-schema';
import { longitudinalSchema, type Longitudinal } from '../../../../../shared/geometry/part-schema';
import { Button } from '../../../../components/ui/button';
import { ConfirmInline } from '../../../../components/ui/confirm-inline';
import { InputField, SelectField } from '../../../../components/ui/field';
import { newLongitudinal } from '../../editor/part-defaults';
import { longitudinalAdd, longitudinalDelete, longitudinalUpdate } from '../../editor/part-actions';
import { edit } from '../../editor/types';
import { useEditor, usePlanEditor } from '../../hooks/use-plan-editor';

interface Values {
  name: string;
  kind: Longitudinal['kind'];
  by: Longitudinal['placement']['by'];
  lineId: string;
  placementValue: string;
  girthOffsetMm: string;
  widthMm: string;
  depthMm: string;
  sides: Longitudinal['sides'];
  against: Longitudinal['against'];
  fromX: string;
  toX: string;
}

const kindWords: Record<Longitudinal['kind'], string> = { stringer: 'Stringer', clamp: 'Clamp', carlin: 'Carlin', hog: 'Hog', keel: 'Keel', ribband: 'Ribband' };

function valuesOf(l: Longitudinal): Values {
  const p = l.placement;
  return {
    name: l.name,
    kind: l.kind,
    by: p.by,
    lineId: p.by === 'line' ? p.lineId : '',
    placementValue: String(p.by === 'height' ? p.z : p.by === 'girth' ? p.girthMm : p.by === 'half-breadth' ? p.y : ''),
    girthOffsetMm: String(p.by === 'line' ? p.girthOffsetMm : 0),
    widthMm: String(l.widthMm),
    depthMm: String(l.depthMm),
    sides: l.sides,
    against: l.against,
    fromX: l.fromX === null ? '' : String(l.fromX),
    toX: l.toX === null ? '' : String(l.toX),
  };
}

/** Text fields to a longitudinal, then the shared schema; a number that is not one is named with its field. */
function formSchema(id: string) {
  return z
    .custom<Values>()
    .transform((v, ctx): z.input<typeof longitudinalSchema> => {
      const num = (field: keyof Values, what: string, optional = false): number | null => {
        const t = v[field].trim().replace(',', '.');
        if (t === '') {
          if (!optional) ctx.addIssue({ code: 'custom', path: [field], message: `Enter ${what}` });
          return null;
        }
        const n = Number(t);
        if (!Number.isFinite(n)) ctx.addIssue({ code: 'custom', path: [field], message: `${what} must be a number, found "${v[field].trim()}"` });
        return Number.isFinite(n) ? n : null;
      };
      const value = (what: string) => num('placementValue', what) ?? 0;
      const placement =
        v.by === 'line'
          ? { by: 'line' as const, lineId: v.lineId, girthOffsetMm: num('girthOffsetMm', 'the girth offset from the line (mm)', true) ?? 0 }
          : v.by === 'height'
            ? { by: 'height' as const, z: value('the height (mm above the baseline)') }
            : v.by === 'girth'
              ? { by: 'girth' as const, girthMm: value('the girth from the centreline (mm)') }
              : { by: 'half-breadth' as const, y: value('the half-breadth (mm)') };
      if (v.by === 'line' && !v.lineId) ctx.addIssue({ code: 'custom', path: ['lineId'], message: 'Choose the line it follows' });
      return {
        id,
        name: v.name,
        kind: v.kind,
        placement,
        widthMm: num('widthMm', 'the width (mm)') ?? 0,
        depthMm: num('depthMm', 'the depth (mm)') ?? 0,
        sides: v.sides,
        against: v.against,
        fromX: num('fromX', 'where it starts (x, mm)', true),
        toX: num('toX', 'where it ends (x, mm)', true),
      };
    })
    .pipe(longitudinalSchema);
}

function placementWords(l: Longitudinal, lines: readonly Line[]): string {
  const p = l.placement;
  if (p.by === 'line') return `on ${lines.find((line) => line.id === p.lineId)?.name ?? 'a line no longer in the table'}${p.girthOffsetMm ? `, ${p.girthOffsetMm} mm along the girth` : ''}`;
  if (p.by === 'height') return `at height ${p.z} mm`;
  if (p.by === 'girth') return `${p.girthMm} mm along the girth from the centreline`;
  return `at half-breadth ${p.y} mm`;
}

function LongitudinalForm({ longitudinal, onDone }: { longitudinal: Longitudinal; onDone: () => void }) {
  const { store } = usePlanEditor();
  const lines = useEditor((s) => s.plan.lines.lines);
  const pointLines = lines.filter((l) => l.kind === 'point');
  const {
    register,
    handleSubmit,
    watch,
    formState: { errors },
  } = useForm<Values, unknown, Longitudinal>({ resolver: zodResolver(formSchema(longitudinal.id)), defaultValues: valuesOf(longitudinal) });
  const by = watch('by');
  return (
    <form
      noValidate
      className="grid grid-cols-1 items-start gap-3 rounded-lg bg-paper p-3 md:grid-cols-3"
      onSubmit={handleSubmit((next) => {
        store.getState().apply(edit(`Change ${longitudinal.name}`, longitudinalUpdate, { longitudinal: next }));
        onDone();
      })}
    >
      <InputField label="Name" maxLength={40} error={errors.name?.message} {...register('name')} />
      <SelectField label="Kind" {...register('kind')}>
        {Object.entries(kindWords).map(([k, w]) => (
          <option key={k} value={k}>
            {w}
          </option>
        ))}
      </SelectField>
      <SelectField label="Placed by" {...register('by')}>
        <option value="line">Following a line (sheer, chine, keel)</option>
        <option value="height">At a height</option>
        <option value="girth">At a girth from the centreline</option>
        <option value="half-breadth">At a half-breadth (a carlin)</option>
      </SelectField>
      {by === 'line' ? (
        <>
          <SelectField label="Line" error={errors.lineId?.message} {...register('lineId')}>
            <option value="">Choose a line</option>
            {pointLines.map((l) => (
              <option key={l.id} value={l.id}>
                {l.name}
              </option>
            ))}
          </SelectField>
          <InputField label="Along the girth from the line (mm)" hint="Positive toward the sheer." inputMode="decimal" error={errors.girthOffsetMm?.message} {...register('girthOffsetMm')} />
        </>
      ) : (
        <InputField label={by === 'height' ? 'Height (mm above the baseline)' : by === 'girth' ? 'Girth from the centreline (mm)' : 'Half-breadth (mm)'} inputMode="decimal" error={errors.placementValue?.message} {...register('placementValue')} />
      )}
      <InputField label="Width (mm)" inputMode="decimal" error={errors.widthMm?.message} {...register('widthMm')} />
      <InputField label="Depth (mm)" inputMode="decimal" error={errors.depthMm?.message} {...register('depthMm')} />
      <SelectField label="Sides" {...register('sides')}>
        <option value="both">A pair, one each side</option>
        <option value="centreline">One, on the centreline</option>
      </SelectField>
      <SelectField label="Lies against" {...register('against')}>
        <option value="skin">The skin</option>
        <option value="deck">The underside of the deck</option>
      </SelectField>
      <InputField label="Starts at x (mm, empty: first station)" inputMode="decimal" error={errors.fromX?.message} {...register('fromX')} />
      <InputField label="Ends at x (mm, empty: last station)" inputMode="decimal" error={errors.toX?.message} {...register('toX')} />
      <div className="flex gap-2 md:col-span-3">
        <Button type="submit">Save longitudinal</Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

function LongitudinalItem({ longitudinal, readOnly }: { longitudinal: Longitudinal; readOnly: boolean }) {
  const { store } = usePlanEditor();
  const lines = useEditor((s) => s.plan.lines.lines);
  const [mode, setMode] = useState<'view' | 'edit' | 'delete'>('view');
  return (
    <li className="flex flex-col gap-3 border-b border-rule py-3 last:border-b-0">
      <div className="flex flex-wrap items-center gap-3">
        <span className="font-semibold">{longitudinal.name}</span>
        <span className="text-muted">
          {kindWords[longitudinal.kind]}, {placementWords(longitudinal, lines)}, {longitudinal.widthMm} × {longitudinal.depthMm} mm
        </span>
        {!readOnly && (
          <div className="ml-auto flex gap-2">
            <Button variant="secondary" aria-label={`Change ${longitudinal.name}`} onClick={() => setMode('edit')}>
              <Pencil aria-hidden="true" className="size-5" />
              Change
            </Button>
            <Button variant="secondary" aria-label={`Delete ${longitudinal.name}`} onClick={() => setMode('delete')}>
              <Trash2 aria-hidden="true" className="size-5" />
              Delete
            </Button>
          </div>
        )}
      </div>
      {mode === 'edit' && <LongitudinalForm longitudinal={longitudinal} onDone={() => setMode('view')} />}
      {mode === 'delete' && (
        <ConfirmInline
          question={`Delete ${longitudinal.name}? The parts stop being notched for it. Undo brings it back.`}
          confirmLabel={`Yes, delete ${longitudinal.name}`}
          onCancel={() => setMode('view')}
          onConfirm={() => store.getState().apply(edit(`Delete ${longitudinal.name}`, longitudinalDelete, { longitudinalId: longitudinal.id }))}
        />
      )}
    </li>
  );
}

/** The hull's longitudinals (stringers, clamps, carlins...), defined once and notched into the parts. */
export function LongitudinalsSection({ readOnly }: { readOnly: boolean }) {
  const { store } = usePlanEditor();
  const longitudinals = useEditor((s) => s.plan.parts.longitudinals);
  return (
    <section aria-labelledby="longitudinals-heading" className="flex flex-col gap-3">
      <h3 id="longitudinals-heading" className="text-xl font-bold">
        Longitudinals
      </h3>
      <p className="text-muted">Stringers, clamps, carlins and the like run along the hull; the frames they pass are notched for them.</p>
      {longitudinals.length === 0 ? (
        <p className="text-muted">None yet.</p>
      ) : (
        <ul className="rounded-xl border border-rule bg-surface px-4">
          {longitudinals.map((l) => (
            <LongitudinalItem key={l.id} longitudinal={l} readOnly={readOnly} />
          ))}
        </ul>
      )}
      {!readOnly && (
        <div>
          <Button
            variant="secondary"
            onClick={() => {
              const added = newLongitudinal(store.getState().plan);
              store.getState().apply(edit(`Add ${added.name}`, longitudinalAdd, { longitudinal: added }));
            }}
          >
            <Plus aria-hidden="true" className="size-5" />
            Add a longitudinal
          </Button>
        </div>
      )}
    </section>
  );
}
