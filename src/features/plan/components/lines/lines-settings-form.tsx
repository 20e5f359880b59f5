import { useEffect, useMemo } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Plus, Trash2 } from 'lucide-react';
import type { Crown } from '../../../../../shared/geometry/camber-schema';
import type { Deck, HullLines } from '../../../../../shared/geometry/hull-schema';
import { displayPrecisionSchema, lengthUnitSchema, sixteenthMarksSchema } from '../../../../../shared/geometry/notation-schema';
import { lengthFormat, lengthParse } from '../../../../../shared/geometry/notation';
import { Alert } from '../../../../components/ui/alert';
import { Button } from '../../../../components/ui/button';
import { InputField, SelectField } from '../../../../components/ui/field';
import { deckSet, linesSettingsSet, notationSet, skinSet } from '../../editor/settings-actions';
import { numberText } from '../../length-field';
import { useEditor, usePlanEditor } from '../../hooks/use-plan-editor';

const thickness = (what: string) => numberText(what, { min: 0 });

const schema = z.object({
  unit: lengthUnitSchema,
  decimalComma: z.boolean(),
  sixteenthMarks: sixteenthMarksSchema,
  precision: displayPrecisionSchema,
  offsetsTo: z.enum(['outside', 'inside']),
  defaultThicknessMm: thickness('the skin thickness'),
  sheathingMm: thickness('the sheathing thickness'),
  panels: z.array(z.object({ name: z.string().trim().min(1, 'Give the panel a name').max(40), fromLineId: z.string(), toLineId: z.string(), thicknessMm: thickness('the panel’s skin thickness') })),
  hasDeck: z.boolean(),
  deckThicknessMm: z.string(),
  beamAt: z.enum(['sheer-outside', 'inside-clamp']),
  clampWidthMm: z.string(),
  shape: z.enum(['arc', 'parabola', 'custom']),
  convention: z.enum(['one-pattern', 'scaled']),
  crownKind: z.enum(['rise', 'percent-of-beam', 'per-foot']),
  crownValue: z.string(),
  referenceBeam: z.string(),
  xDirection: z.enum(['aft', 'forward']),
  designWaterline: z.string(),
});
type Values = z.input<typeof schema>;
type Parsed = z.output<typeof schema>;

type Settings = Pick<HullLines, 'notation' | 'skin' | 'deck' | 'xDirection' | 'designWaterlineZ'>;

function valuesOf(lines: Settings): Values {
  const deck = lines.deck;
  const crown = deck?.camber.crown;
  const n = lines.notation;
  return {
    unit: n.unit,
    decimalComma: n.decimalComma,
    sixteenthMarks: n.sixteenthMarks,
    precision: n.precision,
    offsetsTo: lines.skin.offsetsTo,
    defaultThicknessMm: String(lines.skin.defaultThicknessMm),
    sheathingMm: String(lines.skin.sheathingMm),
    panels: lines.skin.panels.map((p) => ({ name: p.name, fromLineId: p.fromLineId ?? '', toLineId: p.toLineId ?? '', thicknessMm: String(p.thicknessMm) })),
    hasDeck: deck !== null,
    deckThicknessMm: String(deck?.thicknessMm ?? 9),
    beamAt: deck?.beamAt ?? 'sheer-outside',
    clampWidthMm: String(deck?.clampWidthMm ?? 0),
    shape: deck?.camber.shape ?? 'parabola',
    convention: deck?.camber.convention ?? 'one-pattern',
    crownKind: crown?.kind ?? 'rise',
    crownValue: crown ? String(crown.kind === 'rise' ? crown.riseMm : crown.kind === 'percent-of-beam' ? crown.percent : crown.inchesPerFoot) : '',
    referenceBeam: crown?.kind === 'rise' ? String(crown.referenceBeamMm) : '',
    xDirection: lines.xDirection,
    designWaterline: lines.designWaterlineZ === null ? '' : lengthFormat(lines.designWaterlineZ, n),
  };
}

type FieldError = { field: keyof Values; message: string };

/** The deck from the form, or the field that is wrong. */
function deckOf(v: Parsed, previous: Deck | null): Deck | FieldError | null {
  if (!v.hasDeck) return null;
  const num = (text: string, field: keyof Values, what: string, positive = false): number | FieldError => {
    const value = Number(text.trim().replace(',', '.'));
    if (text.trim() === '' || !Number.isFinite(value) || value < 0 || (positive && value === 0)) return { field, message: `Enter ${what} as a ${positive ? 'positive ' : ''}number${text.trim() ? `, found "${text.trim()}"` : ''}` };
    return value;
  };
  const deckThickness = num(v.deckThicknessMm, 'deckThicknessMm', 'the deck thickness in mm');
  if (typeof deckThickness !== 'number') return deckThickness;
  const clamp = num(v.clampWidthMm, 'clampWidthMm', 'the clamp width in mm');
  if (typeof clamp !== 'number') return clamp;
  const value = num(v.crownValue, 'crownValue', v.crownKind === 'rise' ? 'the crown (rise) in mm' : v.crownKind === 'percent-of-beam' ? 'the crown as a percentage of the beam' : 'the crown in inches per foot of beam');
  if (typeof value !== 'number') return value;
  let crown: Crown;
  if (v.crownKind === 'rise') {
    const beam = num(v.referenceBeam, 'referenceBeam', 'the beam (mm) the rise is given at', true);
    if (typeof beam !== 'number') return beam;
    crown = { kind: 'rise', riseMm: value, referenceBeamMm: beam };
  } else if (v.crownKind === 'percent-of-beam') {
    if (value > 50) return { field: 'crownValue', message: `A crown of ${value} % of the beam is more than the 50 % allowed` };
    crown = { kind: 'percent-of-beam', percent: value };
  } else {
    if (value > 6) return { field: 'crownValue', message: `A crown of ${value} in per foot is more than the 6 allowed` };
    crown = { kind: 'per-foot', inchesPerFoot: value };
  }
  return { thicknessMm: deckThickness, beamAt: v.beamAt, clampWidthMm: clamp, camber: { shape: v.shape, points: previous?.camber.points ?? [], crown, convention: v.convention } };
}

/**
 * The lines' settings: how lengths are written, the skin (thickness, panels, sheathing), the deck and its
 * camber, which way x runs and the design waterline. Applied as one undoable change.
 */
export function LinesSettingsForm({ readOnly }: { readOnly: boolean }) {
  const { store } = usePlanEditor();
  // The settings alone: a change of a cell must not redraw this form.
  const notation = useEditor((s) => s.plan.lines.notation);
  const skin = useEditor((s) => s.plan.lines.skin);
  const deckNow = useEditor((s) => s.plan.lines.deck);
  const xDirection = useEditor((s) => s.plan.lines.xDirection);
  const designWaterlineZ = useEditor((s) => s.plan.lines.designWaterlineZ);
  const lines = useMemo(() => ({ notation, skin, deck: deckNow, xDirection, designWaterlineZ }), [notation, skin, deckNow, xDirection, designWaterlineZ]);
  const pointShape = useEditor((s) =>
    s.plan.lines.lines
      .filter((l) => l.kind === 'point')
      .map((l) => `${l.id}\u0000${l.name}`)
      .join('\u0001'),
  );
  const pointLines = useMemo(() => (pointShape ? pointShape.split('\u0001').map((entry) => ({ id: entry.split('\u0000')[0]!, name: entry.split('\u0000')[1]! })) : []), [pointShape]);
  const {
    register,
    control,
    handleSubmit,
    watch,
    reset,
    setError,
    formState: { errors, isDirty },
  } = useForm<Values, unknown, Parsed>({ resolver: zodResolver(schema), defaultValues: valuesOf(lines) });
  const panels = useFieldArray({ control, name: 'panels' });
  // Undo, redo or another screen changed the settings: show them as they are now.
  useEffect(() => {
    reset(valuesOf(lines));
  }, [lines, reset]);
  const hasDeck = watch('hasDeck');
  const crownKind = watch('crownKind');
  const unit = watch('unit');

  const onSubmit = handleSubmit((v) => {
    const notation = { unit: v.unit, decimalComma: v.decimalComma, sixteenthMarks: v.sixteenthMarks, precision: v.precision };
    let designWaterlineZ: number | null = null;
    if (v.designWaterline.trim()) {
      const read = lengthParse(v.designWaterline, notation);
      if (!read || !read.ok) {
        setError('designWaterline', { message: read ? read.message : 'Enter the height of the design waterline' });
        return;
      }
      designWaterlineZ = read.mm;
    }
    const deck = deckOf(v, lines.deck);
    if (deck && 'field' in deck) {
      setError(deck.field, { message: deck.message });
      return;
    }
    const skin = {
      offsetsTo: v.offsetsTo,
      defaultThicknessMm: v.defaultThicknessMm,
      sheathingMm: v.sheathingMm,
      panels: v.panels.map((p) => ({ name: p.name, fromLineId: p.fromLineId || null, toLineId: p.toLineId || null, thicknessMm: p.thicknessMm })),
    };
    store.getState().apply({
      label: 'Change the lines’ settings',
      apply: (plan) => linesSettingsSet(deckSet(skinSet(notationSet(plan, notation), skin), { deck }), { xDirection: v.xDirection, designWaterlineZ }),
    });
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-6" aria-labelledby="lines-settings-heading">
      <h3 id="lines-settings-heading" className="text-xl font-bold">
        Settings of the lines
      </h3>
      <fieldset disabled={readOnly} className="flex flex-col gap-6">
        <fieldset className="grid grid-cols-1 gap-3 md:grid-cols-2">
          <legend className="mb-2 text-lg font-semibold">How lengths are written</legend>
          <SelectField label="Units of the hull" {...register('unit')}>
            <option value="mm">Millimetres</option>
            <option value="in">Inches</option>
            <option value="ftin">Feet-inches-eighths</option>
          </SelectField>
          <SelectField label="Shown to the nearest" {...register('precision')}>
            <option value="1mm">1 mm</option>
            <option value="0.5mm">0.5 mm</option>
            <option value="0.1mm">0.1 mm</option>
            <option value="1/16in">1/16 in</option>
            <option value="1/32in">1/32 in</option>
          </SelectField>
          {unit === 'ftin' && (
            <SelectField label="Marks after the eighths" {...register('sixteenthMarks')}>
              <option value="plus-sixteenth">+ adds 1/16 in (+- 1/32, ++ 3/32, - takes 1/16 off)</option>
              <option value="plus-only">Only + (1/16 in)</option>
              <option value="none">No marks</option>
            </SelectField>
          )}
          <label className="flex min-h-12 items-center gap-3 md:mt-7">
            <input type="checkbox" className="size-6" {...register('decimalComma')} />
            <span>Decimals with a comma (1049,5)</span>
          </label>
        </fieldset>

        <fieldset className="grid grid-cols-1 gap-3 md:grid-cols-3">
          <legend className="mb-2 text-lg font-semibold">Skin (planking)</legend>
          <SelectField label="The offsets are to the skin's" {...register('offsetsTo')}>
            <option value="outside">Outside (usual in a designer's table)</option>
            <option value="inside">Inside (as measured inside a hull)</option>
          </SelectField>
          <InputField label="Skin thickness (mm)" inputMode="decimal" error={errors.defaultThicknessMm?.message} {...register('defaultThicknessMm')} />
          <InputField label="Sheathing (mm)" hint="Glass and epoxy over the skin." inputMode="decimal" error={errors.sheathingMm?.message} {...register('sheathingMm')} />
          <div className="flex flex-col gap-3 md:col-span-3">
            <p className="font-semibold">Panels of another thickness</p>
            {panels.fields.map((field, i) => (
              <div key={field.id} className="grid grid-cols-1 items-start gap-3 rounded-lg border border-rule p-3 md:grid-cols-[1fr_1fr_1fr_8rem_auto]">
                <InputField label="Panel name" error={errors.panels?.[i]?.name?.message} {...register(`panels.${i}.name`)} />
                <SelectField label="From" {...register(`panels.${i}.fromLineId`)}>
                  <option value="">The keel (centreline)</option>
                  {pointLines.map((l) => (
                    <option key={l.id} value={l.id}>
                      {l.name}
                    </option>
                  ))}
                </SelectField>
                <SelectField label="To" {...register(`panels.${i}.toLineId`)}>
                  <option value="">The sheer</option>
                  {pointLines.map((l) => (
                    <option key={l.id} value={l.id}>
                      {l.name}
                    </option>
                  ))}
                </SelectField>
                <InputField label="Thickness (mm)" inputMode="decimal" error={errors.panels?.[i]?.thicknessMm?.message} {...register(`panels.${i}.thicknessMm`)} />
                <Button variant="secondary" className="md:mt-8" aria-label={`Remove panel ${i + 1}`} onClick={() => panels.remove(i)}>
                  <Trash2 aria-hidden="true" className="size-5" />
                </Button>
              </div>
            ))}
            <div>
              <Button variant="secondary" onClick={() => panels.append({ name: `Panel ${panels.fields.length + 1}`, fromLineId: '', toLineId: '', thicknessMm: String(lines.skin.defaultThicknessMm) })}>
                <Plus aria-hidden="true" className="size-5" />
                Add a panel
              </Button>
            </div>
          </div>
        </fieldset>

        <fieldset className="grid grid-cols-1 gap-3 md:grid-cols-3">
          <legend className="mb-2 text-lg font-semibold">Deck and camber</legend>
          <label className="flex min-h-12 items-center gap-3 md:col-span-3">
            <input type="checkbox" className="size-6" {...register('hasDeck')} />
            <span>This hull has a deck (frames and beams are cut to its camber)</span>
          </label>
          {hasDeck && (
            <>
              <InputField label="Deck thickness (mm)" inputMode="decimal" error={errors.deckThicknessMm?.message} {...register('deckThicknessMm')} />
              <SelectField label="Beam measured" {...register('beamAt')}>
                <option value="sheer-outside">At the sheer, outside the skin</option>
                <option value="inside-clamp">Inside the clamp</option>
              </SelectField>
              <InputField label="Clamp width (mm)" inputMode="decimal" error={errors.clampWidthMm?.message} {...register('clampWidthMm')} />
              <SelectField label="Camber curve" {...register('shape')}>
                <option value="parabola">Parabola</option>
                <option value="arc">Circular arc</option>
                {lines.deck?.camber.shape === 'custom' && <option value="custom">The designer’s own curve</option>}
              </SelectField>
              <SelectField label="Crown given as" {...register('crownKind')}>
                <option value="rise">A rise at a beam (mm)</option>
                <option value="percent-of-beam">A percentage of the beam</option>
                <option value="per-foot">Inches per foot of beam</option>
              </SelectField>
              <InputField label={crownKind === 'rise' ? 'Rise (mm)' : crownKind === 'percent-of-beam' ? 'Crown (% of beam)' : 'Crown (in per foot)'} inputMode="decimal" error={errors.crownValue?.message} {...register('crownValue')} />
              {crownKind === 'rise' && <InputField label="At a beam of (mm)" inputMode="decimal" error={errors.referenceBeam?.message} {...register('referenceBeam')} />}
              <SelectField label="Each station takes" {...register('convention')}>
                <option value="one-pattern">The middle of one pattern cut for the widest beam</option>
                <option value="scaled">The curve scaled to its own beam</option>
              </SelectField>
            </>
          )}
        </fieldset>

        <fieldset className="grid grid-cols-1 gap-3 md:grid-cols-2">
          <legend className="mb-2 text-lg font-semibold">Along the hull</legend>
          <SelectField label="x increases toward" {...register('xDirection')}>
            <option value="aft">The stern (stations counted from the bow)</option>
            <option value="forward">The bow</option>
          </SelectField>
          <InputField label="Design waterline height (optional)" hint="Drawn on the templates." error={errors.designWaterline?.message} {...register('designWaterline')} />
        </fieldset>
      </fieldset>
      {!readOnly && (
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit">Apply settings</Button>
          <Button variant="secondary" disabled={!isDirty} onClick={() => reset(valuesOf(lines))}>
            Put back as they are
          </Button>
          {isDirty && <Alert tone="caution">Changed here but not applied yet.</Alert>}
        </div>
      )}
    </form>
  );
}
