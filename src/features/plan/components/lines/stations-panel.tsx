import { memo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { ArrowUpDown, Plus } from 'lucide-react';
import type { Station } from '../../../../../shared/geometry/hull-schema';
import type { Notation } from '../../../../../shared/geometry/notation-schema';
import { lengthFormat } from '../../../../../shared/geometry/notation';
import { Button } from '../../../../components/ui/button';
import { ConfirmInline } from '../../../../components/ui/confirm-inline';
import { InputField } from '../../../../components/ui/field';
import { stationAdd, stationDelete, stationMove, stationRename, stationReorder, stationsSortByX } from '../../editor/station-actions';
import { edit } from '../../editor/types';
import { ItemControls } from './item-controls';
import { lengthInputMode, lengthText } from '../../length-field';
import { useEditor, usePlanEditor } from '../../hooks/use-plan-editor';

function stationSchema(notation: Notation) {
  return z.object({ name: z.string().trim().min(1, 'Give the station a name').max(40, 'A station name is at most 40 characters'), x: lengthText(notation, 'the station’s position x') });
}

function StationForm({ notation, initial, submitLabel, onSubmit, onCancel }: { notation: Notation; initial: { name: string; x: string }; submitLabel: string; onSubmit: (values: { name: string; x: number }) => string | null; onCancel?: () => void }) {
  const schema = stationSchema(notation);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors },
  } = useForm<z.input<typeof schema>, unknown, z.output<typeof schema>>({ resolver: zodResolver(schema), defaultValues: initial });
  return (
    <form
      noValidate
      className="grid grid-cols-1 items-start gap-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_auto]"
      onSubmit={handleSubmit((values) => {
        const problem = onSubmit(values);
        if (problem) setError('x', { type: 'taken', message: problem });
        else if (!onCancel) reset(initial);
      })}
    >
      <InputField label="Station name" autoComplete="off" error={errors.name?.message} {...register('name')} />
      <InputField label="Position x" hint="From the datum, in the table's units." inputMode={lengthInputMode(notation)} autoComplete="off" error={errors.x?.message} {...register('x')} />
      <div className="flex gap-2 sm:mt-8">
        <Button type="submit">
          {onCancel ? null : <Plus aria-hidden="true" className="size-5" />}
          {submitLabel}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}

const StationItem = memo(function StationItem({ station, index, count, notation }: { station: Station; index: number; count: number; notation: Notation }) {
  const { store } = usePlanEditor();
  const [mode, setMode] = useState<'view' | 'edit' | 'delete'>('view');
  const apply = store.getState().apply;
  return (
    <li className="flex flex-col gap-3 border-b border-rule py-3 last:border-b-0">
      <div className="flex flex-wrap items-center gap-3">
        <span className="min-w-16 font-semibold">{station.name}</span>
        <span className="min-w-20 font-mono text-muted">x {lengthFormat(station.x, notation)}</span>
        <ItemControls
          name={station.name}
          index={index}
          count={count}
          runs="columns"
          onMove={(label, toIndex) => apply(edit(label, stationReorder, { stationId: station.id, toIndex }))}
          onChange={() => setMode('edit')}
          onDelete={() => setMode('delete')}
        />
      </div>
      {mode === 'edit' && (
        <StationForm
          notation={notation}
          initial={{ name: station.name, x: lengthFormat(station.x, notation) }}
          submitLabel="Save station"
          onCancel={() => setMode('view')}
          onSubmit={({ name, x }) => {
            const twin = store.getState().plan.lines.stations.find((s) => s.x === x && s.id !== station.id);
            if (twin) return `${twin.name} is already at x ${lengthFormat(x, notation)}; two stations cannot share a position`;
            store.getState().apply({ label: `Change ${station.name}`, apply: (plan) => stationMove(stationRename(plan, { stationId: station.id, name }), { stationId: station.id, x }) });
            setMode('view');
            return null;
          }}
        />
      )}
      {mode === 'delete' && (
        <ConfirmInline
          question={`Delete ${station.name} and every offset at it? Undo brings it back.`}
          confirmLabel={`Yes, delete ${station.name}`}
          onCancel={() => setMode('view')}
          onConfirm={() => {
            apply(edit(`Delete ${station.name}`, stationDelete, { stationId: station.id }));
          }}
        />
      )}
    </li>
  );
});

/** The stations (the table's columns): add, rename, move along the hull, reorder and delete, each one undoable. */
export function StationsPanel({ notation }: { notation: Notation }) {
  const { store } = usePlanEditor();
  const stations = useEditor((s) => s.plan.lines.stations);
  const outOfOrder = stations.findIndex((s, i) => i > 0 && s.x <= stations[i - 1]!.x);
  const last = stations[stations.length - 1];
  const step = stations.length >= 2 ? last!.x - stations[stations.length - 2]!.x : notation.unit === 'mm' ? 600 : 609.6;
  const nextName = `St ${stations.length}`;
  return (
    <section aria-labelledby="stations-heading" className="flex flex-col gap-3">
      <h3 id="stations-heading" className="text-xl font-bold">
        Stations
      </h3>
      {outOfOrder > 0 && (
        <div className="flex flex-wrap items-center gap-3 rounded-lg border-l-4 border-caution bg-caution-soft px-4 py-3">
          <p>
            The columns are not in order of x: {stations[outOfOrder]!.name} (x {lengthFormat(stations[outOfOrder]!.x, notation)}) comes after {stations[outOfOrder - 1]!.name} (x{' '}
            {lengthFormat(stations[outOfOrder - 1]!.x, notation)}).
          </p>
          <Button variant="secondary" onClick={() => store.getState().apply(edit('Put stations in order of x', stationsSortByX, undefined))}>
            <ArrowUpDown aria-hidden="true" className="size-5" />
            Put in order of x
          </Button>
        </div>
      )}
      {stations.length > 0 && (
        <ul className="rounded-xl border border-rule bg-surface px-4">
          {stations.map((station, index) => (
            <StationItem key={station.id} station={station} index={index} count={stations.length} notation={notation} />
          ))}
        </ul>
      )}
      <div className="rounded-xl border border-rule bg-surface p-4">
        <h4 className="mb-2 font-semibold">Add a station</h4>
        <StationForm
          key={`${stations.length}-${notation.unit}`}
          notation={notation}
          initial={{ name: nextName, x: last ? lengthFormat(last.x + Math.max(step, 1), notation) : '0' }}
          submitLabel="Add station"
          onSubmit={({ name, x }) => {
            const twin = store.getState().plan.lines.stations.find((s) => s.x === x);
            if (twin) return `${twin.name} is already at x ${lengthFormat(x, notation)}; two stations cannot share a position`;
            store.getState().apply(edit(`Add ${name}`, stationAdd, { name, x }));
            return null;
          }}
        />
      </div>
    </section>
  );
}
