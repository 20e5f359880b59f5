import { useEffect, useMemo, useState, type ReactNode } from 'react';
import { useFieldArray, useForm, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import { Plus, Trash2 } from 'lucide-react';
import type { Longitudinal, Part } from '../../../../../shared/geometry/part-schema';
import type { Station } from '../../../../../shared/geometry/hull-schema';
import { Alert } from '../../../../components/ui/alert';
import { Button } from '../../../../components/ui/button';
import { ConfirmInline } from '../../../../components/ui/confirm-inline';
import { InputField, SelectField } from '../../../../components/ui/field';
import { addableKinds, partKindLabels, partOfKind, type AddableKind } from '../../editor/part-defaults';
import { partDelete, partUpdate } from '../../editor/part-actions';
import { edit } from '../../editor/types';
import { usePlanEditor } from '../../hooks/use-plan-editor';
import { emptyOpening, partToForm, type PartFormValues } from './part-form-model';
import { partResolver } from './part-resolver';

type Errors = FieldErrors<PartFormValues>;
type Register = UseFormRegister<PartFormValues>;

const mm = { inputMode: 'decimal' as const, autoComplete: 'off' };

function Section({ title, children, hint }: { title: string; children: ReactNode; hint?: string }) {
  return (
    <fieldset className="flex flex-col gap-3 rounded-xl border border-rule p-4">
      <legend className="px-1 text-lg font-semibold">{title}</legend>
      {hint && <p className="-mt-1 text-sm text-muted">{hint}</p>}
      {children}
    </fieldset>
  );
}

function LayersSection({ register, errors, control }: { register: Register; errors: Errors; control: ReturnType<typeof useForm<PartFormValues, unknown, Part>>['control'] }) {
  const layers = useFieldArray({ control, name: 'layers' });
  const total = (errors as Record<string, { message?: string }>).layersTotal?.message;
  return (
    <Section title="Thickness and layers" hint="Layers are stacked from the marked face; they must add up to the frame's thickness.">
      <InputField label="Frame thickness (mm)" {...mm} error={errors.thicknessMm?.message} {...register('thicknessMm')} />
      {layers.fields.map((field, i) => (
        <div key={field.id} className="grid grid-cols-1 items-start gap-3 rounded-lg bg-paper p-3 sm:grid-cols-[1fr_1fr_1fr_auto]">
          <InputField label={`Layer ${i + 1} thickness (mm)`} {...mm} error={errors.layers?.[i]?.thicknessMm?.message} {...register(`layers.${i}.thicknessMm`)} />
          <InputField label={`Layer ${i + 1} pieces`} hint="Joints are staggered against the next layer." inputMode="numeric" error={errors.layers?.[i]?.pieces?.message} {...register(`layers.${i}.pieces`)} />
          <SelectField label={`Layer ${i + 1} material`} {...register(`layers.${i}.material`)}>
            <option value="plywood">Plywood</option>
            <option value="timber">Timber</option>
          </SelectField>
          <Button variant="secondary" className="sm:mt-8" aria-label={`Remove layer ${i + 1}`} disabled={layers.fields.length === 1} onClick={() => layers.remove(i)}>
            <Trash2 aria-hidden="true" className="size-5" />
          </Button>
        </div>
      ))}
      {total && (
        <p role="alert" className="font-medium text-danger">
          {total}
        </p>
      )}
      <div>
        <Button variant="secondary" onClick={() => layers.append({ thicknessMm: '9', pieces: '1', material: 'plywood' })}>
          <Plus aria-hidden="true" className="size-5" />
          Add a layer
        </Button>
      </div>
    </Section>
  );
}

function LimbersSection({ register, errors, control }: { register: Register; errors: Errors; control: ReturnType<typeof useForm<PartFormValues, unknown, Part>>['control'] }) {
  const limbers = useFieldArray({ control, name: 'limbers' });
  return (
    <Section title="Limber holes" hint="Half-round holes on the outer edge so water can run along the bottom.">
      {limbers.fields.map((field, i) => (
        <div key={field.id} className="grid grid-cols-1 items-start gap-3 rounded-lg bg-paper p-3 sm:grid-cols-[1fr_1fr_1fr_auto]">
          <InputField label={`Limber ${i + 1}: girth from the centreline (mm)`} {...mm} error={errors.limbers?.[i]?.girthMm?.message} {...register(`limbers.${i}.girthMm`)} />
          <InputField label={`Limber ${i + 1}: radius (mm)`} {...mm} error={errors.limbers?.[i]?.radiusMm?.message} {...register(`limbers.${i}.radiusMm`)} />
          <SelectField label={`Limber ${i + 1}: sides`} {...register(`limbers.${i}.sides`)}>
            <option value="both">Both sides</option>
            <option value="port">Port only</option>
            <option value="starboard">Starboard only</option>
          </SelectField>
          <Button variant="secondary" className="sm:mt-8" aria-label={`Remove limber ${i + 1}`} onClick={() => limbers.remove(i)}>
            <Trash2 aria-hidden="true" className="size-5" />
          </Button>
        </div>
      ))}
      <div>
        <Button variant="secondary" onClick={() => limbers.append({ girthMm: '60', radiusMm: '15', sides: 'both' })}>
          <Plus aria-hidden="true" className="size-5" />
          Add a limber hole
        </Button>
      </div>
    </Section>
  );
}

function OpeningsSection({ register, errors, control, watch }: { register: Register; errors: Errors; control: ReturnType<typeof useForm<PartFormValues, unknown, Part>>['control']; watch: ReturnType<typeof useForm<PartFormValues, unknown, Part>>['watch'] }) {
  const openings = useFieldArray({ control, name: 'openings' });
  const shapes = watch('openings');
  return (
    <Section title="Openings" hint="Holes cut through the part: access, lightening, a hatch. Centre across (y) and up (z) in mm.">
      {openings.fields.map((field, i) => {
        const shape = shapes?.[i]?.shape ?? field.shape;
        const e = errors.openings?.[i];
        return (
          <div key={field.id} className="grid grid-cols-1 items-start gap-3 rounded-lg bg-paper p-3 sm:grid-cols-3">
            <SelectField label={`Opening ${i + 1}: shape`} {...register(`openings.${i}.shape`)}>
              <option value="circle">Circle</option>
              <option value="rectangle">Rectangle</option>
              <option value="slot">Slot</option>
            </SelectField>
            <InputField label="Centre across, y (mm)" {...mm} error={e?.y?.message} {...register(`openings.${i}.y`)} />
            <InputField label="Centre height, z (mm)" {...mm} error={e?.z?.message} {...register(`openings.${i}.z`)} />
            {shape === 'circle' && <InputField label="Radius (mm)" {...mm} error={e?.radiusMm?.message} {...register(`openings.${i}.radiusMm`)} />}
            {shape !== 'circle' && <InputField label="Width (mm)" {...mm} error={e?.widthMm?.message} {...register(`openings.${i}.widthMm`)} />}
            {shape === 'rectangle' && <InputField label="Height (mm)" {...mm} error={e?.heightMm?.message} {...register(`openings.${i}.heightMm`)} />}
            {shape === 'rectangle' && <InputField label="Corner radius (mm)" {...mm} error={e?.cornerRadiusMm?.message} {...register(`openings.${i}.cornerRadiusMm`)} />}
            {shape === 'slot' && <InputField label="Length (mm)" {...mm} error={e?.lengthMm?.message} {...register(`openings.${i}.lengthMm`)} />}
            {shape === 'slot' && <InputField label="Angle from level (degrees)" {...mm} error={e?.angleDeg?.message} {...register(`openings.${i}.angleDeg`)} />}
            <label className="flex min-h-12 items-center gap-3">
              <input type="checkbox" className="size-6" {...register(`openings.${i}.mirror`)} />
              <span>Also on the other side</span>
            </label>
            <div>
              <Button variant="secondary" aria-label={`Remove opening ${i + 1}`} onClick={() => openings.remove(i)}>
                <Trash2 aria-hidden="true" className="size-5" />
                Remove
              </Button>
            </div>
          </div>
        );
      })}
      <div>
        <Button variant="secondary" onClick={() => openings.append({ ...emptyOpening, z: '300' })}>
          <Plus aria-hidden="true" className="size-5" />
          Add an opening
        </Button>
      </div>
    </Section>
  );
}

function LongitudinalChecks({ name, longitudinals, register, hint }: { name: 'longitudinalIds' | 'carriesIds'; longitudinals: readonly Longitudinal[]; register: Register; hint?: string }) {
  if (longitudinals.length === 0) return <p className="text-muted">No longitudinals yet: add them under Longitudinals below.</p>;
  return (
    <div className="flex flex-col gap-1">
      {hint && <p className="text-sm text-muted">{hint}</p>}
      {longitudinals.map((l) => (
        <label key={l.id} className="flex min-h-12 items-center gap-3">
          <input type="checkbox" value={l.id} className="size-6" {...register(name)} />
          <span>
            {l.name} <span className="text-muted">({l.kind})</span>
          </span>
        </label>
      ))}
    </div>
  );
}

interface PartFormProps {
  part: Part;
  stations: readonly Station[];
  longitudinals: readonly Longitudinal[];
  readOnly: boolean;
  onDeleted: () => void;
}

/**
 * The form of one part. Changes go into the plan with "Apply changes" as one undoable step; undo and redo
 * (here or on another screen) bring the form back to what the plan holds.
 */
export function PartForm({ part, stations, longitudinals, readOnly, onDeleted }: PartFormProps) {
  const { store } = usePlanEditor();
  const resolver = useMemo(() => partResolver(part), [part]);
  const form = useForm<PartFormValues, unknown, Part>({ resolver, defaultValues: partToForm(part) });
  const {
    register,
    handleSubmit,
    reset,
    watch,
    control,
    formState: { errors, isDirty },
  } = form;
  const [deleting, setDeleting] = useState(false);
  const [applied, setApplied] = useState(false);
  useEffect(() => {
    reset(partToForm(part));
  }, [part, reset]);
  const kind = watch('kind');
  const notchAll = watch('notchAll');
  const hasTaper = watch('hasTaper');
  const inboardBy = watch('inboardEnd.by');
  const carlins = longitudinals.filter((l) => l.kind === 'carlin');

  const onSubmit = handleSubmit((next) => {
    store.getState().apply(edit(`Change ${part.name}`, partUpdate, { part: next }));
    setApplied(true);
  });

  const changeKind = (to: AddableKind) => {
    // A part of another kind: its common fields carry over, the new kind's start from the hull's values.
    const values = form.getValues();
    const fresh = partOfKind(store.getState().plan, to, { ...part, id: part.id, name: values.name || part.name, stationId: values.stationId || ('stationId' in part ? part.stationId : stations[0]?.id ?? ''), thicknessMm: part.thicknessMm, layers: part.layers });
    const kindValues = partToForm(fresh);
    reset({ ...values, ...Object.fromEntries(Object.entries(kindValues).filter(([key]) => !['name', 'stationId', 'thicknessMm', 'layers', 'markedFace', 'filletClearanceMm', 'limbers', 'openings', 'notchAll', 'longitudinalIds', 'bevelMarks'].includes(key))), kind: to }, { keepDefaultValues: true });
  };

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4" aria-label={`Part ${part.name}`} onChange={() => setApplied(false)}>
      {errors.root?.summary && (
        <Alert tone="error" title="Not applied: put these right first">
          <ul className="list-disc pl-5">
            {errors.root.summary.message?.split('\n').map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        </Alert>
      )}
      <fieldset disabled={readOnly} className="flex flex-col gap-4">
        <Section title="The part">
          <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
            <InputField label="Name" autoComplete="off" maxLength={40} error={errors.name?.message} {...register('name')} />
            {part.kind === 'measured-frame' ? (
              <p className="self-end pb-3">Measured frame (its points are taken on the hull)</p>
            ) : (
              <SelectField label="Kind" value={kind} onChange={(e) => changeKind(e.target.value as AddableKind)}>
                {addableKinds.map((k) => (
                  <option key={k} value={k}>
                    {partKindLabels[k]}
                  </option>
                ))}
              </SelectField>
            )}
            {part.kind !== 'measured-frame' && (
              <SelectField label="Station" error={errors.stationId?.message} {...register('stationId')}>
                {stations.map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.name}
                  </option>
                ))}
              </SelectField>
            )}
            <SelectField label="Marked face (on the station line)" {...register('markedFace')}>
              <option value="auto">The larger face (chosen from the bevels)</option>
              <option value="forward">Forward face</option>
              <option value="aft">Aft face</option>
            </SelectField>
            <InputField label="Fillet clearance (mm)" hint="The gap left to the skin for the epoxy fillet." {...mm} error={errors.filletClearanceMm?.message} {...register('filletClearanceMm')} />
          </div>
        </Section>

        <LayersSection register={register} errors={errors} control={control} />

        {kind === 'ring-frame' && (
          <Section title="Ring" hint="The width of the ring inside the outer edge.">
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
              <InputField label="Ring width at the bottom (mm)" {...mm} error={errors.ringWidth?.bottomMm?.message} {...register('ringWidth.bottomMm')} />
              <InputField label="Ring width at the sides (mm)" {...mm} error={errors.ringWidth?.sidesMm?.message} {...register('ringWidth.sidesMm')} />
              <InputField label="Ring width under the deck (mm)" hint="Empty: as at the sides." {...mm} error={errors.ringWidth?.underDeckMm?.message} {...register('ringWidth.underDeckMm')} />
              <InputField label="Inner corner radius (mm)" {...mm} error={errors.innerCornerRadiusMm?.message} {...register('innerCornerRadiusMm')} />
              <SelectField label="At the top" {...register('top')}>
                <option value="deck">Closed under the deck</option>
                <option value="open">Open, the arms end at the sheer</option>
              </SelectField>
            </div>
          </Section>
        )}
        {(kind === 'partial-bulkhead' || kind === 'floor') && (
          <Section title={kind === 'floor' ? 'Floor' : 'Partial bulkhead'}>
            <InputField label="Top, height above the baseline (mm)" hint="Cut level there." {...mm} error={errors.topZ?.message} {...register('topZ')} />
          </Section>
        )}
        {(kind === 'deck-beam' || kind === 'half-beam') && (
          <Section title="Beam" hint="The top follows the deck camber, less the deck thickness.">
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
              <InputField label="Moulded depth at the centreline (mm)" {...mm} error={errors.mouldedDepthMm?.message} {...register('mouldedDepthMm')} />
              <label className="flex min-h-12 items-center gap-3 sm:mt-7">
                <input type="checkbox" className="size-6" {...register('hasTaper')} />
                <span>Tapered toward the ends</span>
              </label>
              {hasTaper && <InputField label="Depth at the ends (mm)" {...mm} error={errors.taper?.endDepthMm?.message} {...register('taper.endDepthMm')} />}
              {hasTaper && <InputField label="Taper starts at (0 = centreline, 1 = end)" {...mm} error={errors.taper?.fromFraction?.message} {...register('taper.fromFraction')} />}
              {kind === 'half-beam' && (
                <>
                  <SelectField label="Inboard end" {...register('inboardEnd.by')}>
                    <option value="half-breadth">At a half-breadth</option>
                    <option value="carlin">At a carlin</option>
                  </SelectField>
                  {inboardBy === 'carlin' ? (
                    <SelectField label="Carlin" error={errors.inboardEnd?.carlinId?.message} {...register('inboardEnd.carlinId')}>
                      <option value="">Choose a carlin</option>
                      {carlins.map((c) => (
                        <option key={c.id} value={c.id}>
                          {c.name}
                        </option>
                      ))}
                    </SelectField>
                  ) : (
                    <InputField label="Half-breadth of the inboard end (mm)" {...mm} error={errors.inboardEnd?.yMm?.message} {...register('inboardEnd.yMm')} />
                  )}
                  <SelectField label="Sides" {...register('sides')}>
                    <option value="both">A pair, one each side</option>
                    <option value="port">Port only</option>
                    <option value="starboard">Starboard only</option>
                  </SelectField>
                </>
              )}
            </div>
          </Section>
        )}
        {kind === 'transom' && (
          <Section title="Transom">
            <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
              <InputField label="Rake from the vertical (degrees)" hint="Positive: the top is aft of the bottom." {...mm} error={errors.rakeDeg?.message} {...register('rakeDeg')} />
              <InputField label="Crosses the station at height (mm)" {...mm} error={errors.pivotZ?.message} {...register('pivotZ')} />
            </div>
          </Section>
        )}
        {kind === 'mould' && (
          <Section title="Longitudinals the mould carries" hint="Their depth is taken off the mould's edge.">
            <LongitudinalChecks name="carriesIds" longitudinals={longitudinals} register={register} />
          </Section>
        )}

        <Section title="Notches" hint="Where longitudinals pass through the part.">
          <label className="flex min-h-12 items-center gap-3">
            <input type="checkbox" className="size-6" {...register('notchAll')} />
            <span>Notch for every longitudinal that runs past this station</span>
          </label>
          {!notchAll && <LongitudinalChecks name="longitudinalIds" longitudinals={longitudinals} register={register} hint="Only these:" />}
        </Section>

        <LimbersSection register={register} errors={errors} control={control} />
        {kind !== 'ring-frame' && <OpeningsSection register={register} errors={errors} control={control} watch={watch} />}

        <Section title="Bevel marks">
          <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
            <InputField label="A bevel mark every (mm of edge)" {...mm} error={errors.bevelMarks?.everyMm?.message} {...register('bevelMarks.everyMm')} />
            <InputField label="Warn past a saw tilt of (degrees)" {...mm} error={errors.bevelMarks?.sawTiltLimitDeg?.message} {...register('bevelMarks.sawTiltLimitDeg')} />
          </div>
        </Section>
      </fieldset>

      {!readOnly && (
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit">Apply changes</Button>
          <Button variant="secondary" disabled={!isDirty} onClick={() => reset(partToForm(part))}>
            Put back as it is
          </Button>
          {applied && !isDirty && <span className="font-medium text-ok">Applied. Undo takes it back.</span>}
          <div className="ml-auto">
            {deleting ? (
              <ConfirmInline
                question={`Delete ${part.name}? Undo brings it back.`}
                confirmLabel={`Yes, delete ${part.name}`}
                onCancel={() => setDeleting(false)}
                onConfirm={() => {
                  store.getState().apply(edit(`Delete ${part.name}`, partDelete, { partId: part.id }));
                  onDeleted();
                }}
              />
            ) : (
              <Button variant="danger" onClick={() => setDeleting(true)}>
                <Trash2 aria-hidden="true" className="size-5" />
                Delete part
              </Button>
            )}
          </div>
        </div>
      )}
    </form>
  );
}
