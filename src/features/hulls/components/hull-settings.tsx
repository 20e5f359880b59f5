import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Archive, ArchiveRestore, Pencil } from 'lucide-react';
import type { HullSummary } from '../../../../shared/api/hulls';
import { renameHullSchema } from '../../../../shared/api/plan';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { ConfirmInline } from '../../../components/ui/confirm-inline';
import { InputField } from '../../../components/ui/field';
import { describeError } from '../../../lib/api-client';
import { showServerError } from '../../../lib/form-errors';
import { useArchiveHull } from '../api/archive-hull';
import { useRenameHull } from '../api/rename-hull';
import { useUnarchiveHull } from '../api/unarchive-hull';

function RenameForm({ hull, onDone }: { hull: HullSummary; onDone: () => void }) {
  const rename = useRenameHull(hull.id);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<{ name: string }>({ resolver: zodResolver(renameHullSchema), defaultValues: { name: hull.name } });
  const onSubmit = handleSubmit(async ({ name }) => {
    try {
      await rename.mutateAsync(name);
      onDone();
    } catch (error) {
      showServerError(error, setError, ['name']);
    }
  });
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-3">
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      <InputField label="New name" autoComplete="off" maxLength={120} error={errors.name?.message} {...register('name')} />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={isSubmitting}>
          Rename hull
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** Rename (owner and builder) and archive or bring back (owner only); nobody else sees this. */
export function HullSettings({ hull }: { hull: HullSummary }) {
  const canRename = hull.role === 'owner' || hull.role === 'builder';
  const canArchive = hull.role === 'owner';
  const [renaming, setRenaming] = useState(false);
  const [askArchive, setAskArchive] = useState(false);
  const archive = useArchiveHull(hull.id);
  const unarchive = useUnarchiveHull(hull.id);
  if (!canRename && !canArchive) return null;
  const failed = archive.error ?? unarchive.error;

  return (
    <Card className="flex flex-col gap-4">
      <h2 className="text-xl font-bold">Hull settings</h2>
      {hull.archived && <Alert tone="caution">This hull is archived: it is kept as it is and listed apart from the current hulls.</Alert>}
      {canRename &&
        (renaming ? (
          <RenameForm hull={hull} onDone={() => setRenaming(false)} />
        ) : (
          <div>
            <Button variant="secondary" onClick={() => setRenaming(true)}>
              <Pencil aria-hidden="true" className="size-5" />
              Rename hull
            </Button>
          </div>
        ))}
      {canArchive &&
        (hull.archived ? (
          <div>
            <Button variant="secondary" busy={unarchive.isPending} onClick={() => unarchive.mutate()}>
              <ArchiveRestore aria-hidden="true" className="size-5" />
              Bring back from the archive
            </Button>
          </div>
        ) : askArchive ? (
          <ConfirmInline
            question="Archive this hull? It is kept whole and can be brought back at any time; it moves to the archived list."
            confirmLabel="Yes, archive it"
            tone="primary"
            busy={archive.isPending}
            onCancel={() => setAskArchive(false)}
            onConfirm={() => archive.mutate(undefined, { onSuccess: () => setAskArchive(false) })}
          />
        ) : (
          <div>
            <Button variant="secondary" onClick={() => setAskArchive(true)}>
              <Archive aria-hidden="true" className="size-5" />
              Archive hull
            </Button>
          </div>
        ))}
      {failed && <Alert tone="error">{describeError(failed)}</Alert>}
    </Card>
  );
}
