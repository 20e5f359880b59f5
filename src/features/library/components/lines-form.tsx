import { useQuery } from '@tanstack/react-query';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { sharingSchema, visibilitySchema, type LinesRevisionInput, type SharingInput } from '../../../../shared/api/library';
import { hullIssues } from '../../../../shared/geometry/hull';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { InputField, SelectField, TextareaField } from '../../../components/ui/field';
import { ApiError, describeError } from '../../../lib/api-client';
import { getHullListQueryOptions } from '../api/get-editable-hulls';
import { useHullLines } from '../api/get-hull-lines';
import { splitEmails } from './camber-form-values';
import { DocumentPreview } from './document-preview';
import { SharingFields } from './sharing-fields';

const linesFormSchema = z.object({
  hullId: z.string().min(1, { message: 'Choose the hull whose lines to publish' }),
  name: z.string().trim().min(1, { message: 'Give it a name' }).max(120),
  notes: z.string().max(4000),
  rules: z.string().max(4000),
  visibility: visibilitySchema,
  shareWith: z.string(),
});
export type LinesFormValues = z.infer<typeof linesFormSchema>;

export const emptyLinesForm: LinesFormValues = { hullId: '', name: '', notes: '', rules: '', visibility: 'private', shareWith: '' };

/**
 * Publish lines (stations and the table of offsets), or their next revision, from a hull one is on: the
 * designer keeps the lines in a hull of their own and publishes them from there.
 */
export function LinesForm({ initial, withSharing, submitLabel, onSubmit }: { initial: LinesFormValues; withSharing: boolean; submitLabel: string; onSubmit: (input: { revision: LinesRevisionInput; sharing: SharingInput }) => Promise<void> }) {
  const hulls = useQuery(getHullListQueryOptions());
  const {
    register,
    handleSubmit,
    watch,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<LinesFormValues>({ resolver: zodResolver(linesFormSchema), defaultValues: initial });
  const values = watch();
  const hullId = values.hullId ? Number(values.hullId) : null;
  const lines = useHullLines(hullId);

  const submit = handleSubmit(async (v) => {
    if (!lines.data) return setError('hullId', { type: 'validate', message: 'The lines of this hull are still loading; try again in a moment' });
    const issues = hullIssues(lines.data.lines);
    if (issues.length) return setError('hullId', { type: 'validate', message: `These lines do not make a hull yet: ${issues[0]!.message}` });
    const sharing = { visibility: v.visibility, shareWith: splitEmails(v.shareWith) };
    if (withSharing) {
      const shared = sharingSchema.safeParse(sharing);
      if (!shared.success) {
        const index = shared.error.issues[0]!.path[1];
        return setError('shareWith', { type: 'validate', message: typeof index === 'number' ? `“${sharing.shareWith[index]}” is not an e-mail address` : shared.error.issues[0]!.message });
      }
    }
    try {
      await onSubmit({ revision: { name: v.name, notes: v.notes, rules: v.rules, document: lines.data.lines }, sharing });
    } catch (error) {
      if (error instanceof ApiError && error.field?.includes('document')) setError('hullId', { type: 'server', message: error.message });
      else if (error instanceof ApiError && error.field?.endsWith('name')) setError('name', { type: 'server', message: error.message });
      else setError('root.server', { type: 'server', message: describeError(error) });
    }
  });

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-6">
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      <SelectField label="Lines from the hull" hint="The stations and the table of offsets of that hull’s latest revision." error={errors.hullId?.message} {...register('hullId')}>
        <option value="">Choose a hull…</option>
        {hulls.data?.hulls.map((h) => (
          <option key={h.id} value={String(h.id)}>
            {h.name}
          </option>
        ))}
      </SelectField>
      {lines.data && (
        <DocumentPreview kind="lines" document={lines.data.lines} label={`Lines of ${hulls.data?.hulls.find((h) => h.id === hullId)?.name ?? 'the hull'}`} />
      )}
      <InputField label="Name" error={errors.name?.message} {...register('name')} />
      <TextareaField label="Notes" hint="What the lines are, what they were drawn from, to which side of the skin." rows={3} error={errors.notes?.message} {...register('notes')} />
      <TextareaField label="Rules that go with them" hint="The skin and stations they assume, what to check before cutting." rows={3} error={errors.rules?.message} {...register('rules')} />
      {withSharing && <SharingFields register={register} errors={errors} visibility={values.visibility} />}
      <div>
        <Button type="submit" busy={isSubmitting}>
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
