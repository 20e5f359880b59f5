import { useForm } from 'react-hook-form';
import { sharingSchema, type LibraryItemDetail, type Visibility } from '../../../../shared/api/library';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { describeError } from '../../../lib/api-client';
import { useUpdateSharing } from '../api/update-sharing';
import { splitEmails } from './camber-form-values';
import { SharingFields } from './sharing-fields';

interface SharingValues {
  visibility: Visibility;
  shareWith: string;
}

/** The author changes who may see the item; its revisions stay as they are. */
export function SharingForm({ item }: { item: LibraryItemDetail }) {
  const update = useUpdateSharing(item.id);
  const {
    register,
    handleSubmit,
    watch,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SharingValues>({ defaultValues: { visibility: item.visibility, shareWith: (item.shareWith ?? []).join('\n') } });

  const submit = handleSubmit(async (v) => {
    const sharing = { visibility: v.visibility, shareWith: splitEmails(v.shareWith) };
    const parsed = sharingSchema.safeParse(sharing);
    if (!parsed.success) {
      const index = parsed.error.issues[0]!.path[1];
      return setError('shareWith', { type: 'validate', message: typeof index === 'number' ? `“${sharing.shareWith[index]}” is not an e-mail address` : parsed.error.issues[0]!.message });
    }
    try {
      await update.mutateAsync(sharing);
    } catch (error) {
      setError('root.server', { type: 'server', message: describeError(error) });
    }
  });

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4">
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      {update.isSuccess && !isSubmitting && <Alert tone="ok">Saved: {update.data.item.visibility === 'shared' ? `shared with ${update.data.item.shareWith?.length ?? 0} people` : update.data.item.visibility}.</Alert>}
      <SharingFields register={register} errors={errors} visibility={watch('visibility')} />
      <div>
        <Button type="submit" variant="secondary" busy={isSubmitting}>
          Save who may see it
        </Button>
      </div>
    </form>
  );
}
