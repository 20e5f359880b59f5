import { useForm, type Resolver } from 'react-hook-form';
import type { CamberRevisionInput, SharingInput } from '../../../../shared/api/library';
import type { Camber } from '../../../../shared/geometry/camber-schema';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { InputField, SelectField, TextareaField } from '../../../components/ui/field';
import { ApiError, describeError } from '../../../lib/api-client';
import { asFieldErrors, camberFieldOfServerPath, camberFormToInput, type CamberFormField, type CamberFormValues } from './camber-form-values';
import { CamberDrawing } from './camber-drawing';
import { camberPoints, PREVIEW_HALF_BEAM_MM } from './document-preview';
import { conventionLabels, crownKindLabels, shapeLabels } from './library-words';
import { SharingFields } from './sharing-fields';

export interface CamberFormProps {
  initial: CamberFormValues;
  /** A first publication chooses who may see it; a new revision keeps the item's choice. */
  withSharing: boolean;
  submitLabel: string;
  /** Resolves on success; a rejection with the server's error is shown under the field it names, else at the top. */
  onSubmit: (input: { revision: CamberRevisionInput; sharing: SharingInput }) => Promise<void>;
}

const resolverFor =
  (withSharing: boolean): Resolver<CamberFormValues> =>
  async (values) => {
    const result = camberFormToInput(values, withSharing);
    return result.ok ? { values, errors: {} } : { values: {}, errors: asFieldErrors(result.errors) };
  };

/** Publish a camber curve, or its next revision: shape, crown, convention, the designer's own points, with the curve drawn as it is typed. */
export function CamberForm({ initial, withSharing, submitLabel, onSubmit }: CamberFormProps) {
  const {
    register,
    handleSubmit,
    watch,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CamberFormValues>({ resolver: resolverFor(withSharing), defaultValues: initial });

  const values = watch();
  const preview = camberFormToInput(values, false);
  const drawn = preview.ok ? camberPoints(preview.revision.document as Camber) : null;

  const submit = handleSubmit(async (v) => {
    const result = camberFormToInput(v, withSharing);
    if (!result.ok) return;
    try {
      await onSubmit({ revision: result.revision, sharing: result.sharing });
    } catch (error) {
      const field = error instanceof ApiError && error.field ? camberFieldOfServerPath(error.field, v.crownKind) : null;
      if (field) setError(field, { type: 'server', message: error instanceof ApiError ? error.message : '' }, { shouldFocus: true });
      else setError('root.server', { type: 'server', message: describeError(error) });
    }
  });
  const fieldError = (field: CamberFormField) => errors[field]?.message;

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-6">
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      <InputField label="Name" hint="As builders will see it in the Library, e.g. “Deck camber, 4.9 m skiff”." error={fieldError('name')} {...register('name')} />

      <fieldset className="grid grid-cols-1 gap-4 md:grid-cols-2">
        <legend className="mb-2 text-lg font-semibold">The curve</legend>
        <SelectField label="Shape" error={fieldError('shape')} {...register('shape')}>
          {(['parabola', 'arc', 'custom'] as const).map((s) => (
            <option key={s} value={s}>
              {shapeLabels[s]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Crown given as" {...register('crownKind')}>
          {(['rise', 'percent-of-beam', 'per-foot'] as const).map((k) => (
            <option key={k} value={k}>
              {crownKindLabels[k]}
            </option>
          ))}
        </SelectField>
        {values.crownKind === 'rise' && (
          <>
            <InputField label="Rise (mm)" hint="At the centreline, above the line joining the beam ends." inputMode="decimal" className="font-mono" error={fieldError('riseMm')} {...register('riseMm')} />
            <InputField label="At a beam of (mm)" hint="Usually the widest beam of the deck." inputMode="decimal" className="font-mono" error={fieldError('referenceBeamMm')} {...register('referenceBeamMm')} />
          </>
        )}
        {values.crownKind === 'percent-of-beam' && (
          <InputField label="Percent of the beam" inputMode="decimal" className="font-mono" error={fieldError('percent')} {...register('percent')} />
        )}
        {values.crownKind === 'per-foot' && (
          <InputField label="Inches per foot of beam" hint="E.g. 0.25 for 1/4 in per foot." inputMode="decimal" className="font-mono" error={fieldError('inchesPerFoot')} {...register('inchesPerFoot')} />
        )}
        <SelectField
          label="Convention"
          hint="One pattern: cut once for the widest beam; every station takes its middle part. Scaled: the curve is fitted to each station’s beam."
          error={fieldError('convention')}
          {...register('convention')}
        >
          {(['one-pattern', 'scaled'] as const).map((c) => (
            <option key={c} value={c}>
              {conventionLabels[c]}
            </option>
          ))}
        </SelectField>
        {values.shape === 'custom' && (
          <TextareaField
            label="Own points"
            hint="One point a line: across, then height. Across runs from 0 at the centreline to 1 at the beam’s edge; height from 1 (the full crown) down to 0. Start with 0, 1 and end with 1, 0."
            rows={6}
            className="font-mono"
            error={fieldError('points')}
            {...register('points')}
          />
        )}
      </fieldset>

      <section aria-label="The curve drawn" className="flex flex-col gap-1">
        {drawn ? (
          <>
            <CamberDrawing curves={[{ points: drawn.points, label: values.name.trim() || 'This curve', tone: 'after' }]} halfBeamMm={drawn.halfBeamMm} title="The camber pattern as typed" />
            {values.crownKind !== 'rise' && <p className="text-sm text-muted">Drawn over a {2 * PREVIEW_HALF_BEAM_MM} mm beam; each hull uses its own.</p>}
          </>
        ) : (
          <p className="text-muted">The curve is drawn here once the numbers above make one.</p>
        )}
      </section>

      <TextareaField label="Notes" hint="What it is for, what it was drawn from." rows={3} error={fieldError('notes')} {...register('notes')} />
      <TextareaField label="Rules that go with it" hint="Where it applies, how the rise is measured, what to check before cutting." rows={3} error={fieldError('rules')} {...register('rules')} />
      {withSharing && <SharingFields register={register} errors={errors} visibility={values.visibility} />}
      <div>
        <Button type="submit" busy={isSubmitting}>
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
