import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { LibraryItemDetail, PinSaveResponse } from '../../../../shared/api/library';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { ApiError, describeError } from '../../../lib/api-client';
import { useEditableHulls } from '../api/get-editable-hulls';
import { getHullPlanQueryOptions } from '../api/get-hull-lines';
import { useTakeIntoHull } from '../api/take-into-hull';
import { kindLabels } from './library-words';

function takeErrorText(error: unknown): string {
  if (error instanceof ApiError && error.code === 'stale_revision') return 'Someone saved the hull’s plan just now. Press Take into hull again to take it into the newest revision.';
  return describeError(error);
}

/** "Take into hull": choose a hull (one whose lines and camber you may change) and a revision; the hull then pins it. */
export function TakeIntoHullForm({ item }: { item: LibraryItemDetail }) {
  const hulls = useEditableHulls();
  const take = useTakeIntoHull();
  const queryClient = useQueryClient();
  const [hullId, setHullId] = useState('');
  const [revisionId, setRevisionId] = useState(String(item.latest.id));
  const [missingHull, setMissingHull] = useState(false);
  const [done, setDone] = useState<{ hullId: number; hullName: string; saved: PinSaveResponse } | null>(null);

  if (hulls.isSuccess && hulls.data.length === 0) {
    return <p className="text-muted">You are not an owner, builder or designer on any hull, so there is no hull to take this into. Make a hull first.</p>;
  }

  const submit = async (event: React.FormEvent) => {
    event.preventDefault();
    if (!hullId) return setMissingHull(true);
    const id = Number(hullId);
    take.reset();
    setDone(null);
    try {
      // The base is the hull's latest revision as it is now, not as some page cached it.
      const latest = await queryClient.fetchQuery({ ...getHullPlanQueryOptions(id), staleTime: 0 });
      const saved = await take.mutateAsync({ hullId: id, itemId: item.id, revisionId: Number(revisionId), baseRevisionId: latest.revision?.id ?? null });
      setDone({ hullId: id, hullName: hulls.data?.find((h) => h.id === id)?.name ?? 'the hull', saved });
    } catch {
      // Shown from take.error below.
    }
  };

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4" aria-labelledby="take-heading">
      <h2 id="take-heading" className="text-xl font-bold">
        Take into hull
      </h2>
      <p className="text-muted">
        {item.kind === 'camber'
          ? 'The hull’s deck gets this camber (its deck thickness stays). '
          : 'The hull gets these stations and offsets (its skin, deck and parts stay; the parts must find their stations). '}
        It becomes a new revision of the hull’s plan, and you hear of newer revisions.
      </p>
      {take.isError && <Alert tone="error">{takeErrorText(take.error)}</Alert>}
      {done && (
        <Alert tone="ok" title={`Taken into ${done.hullName}.`}>
          <p>
            {kindLabels[item.kind]} revision {done.saved.pin.revisionNumber} is now in the plan (plan revision {done.saved.revision.id}).{' '}
            <Link to={`/hulls/${done.hullId}/library`} className="font-semibold text-primary underline underline-offset-4">
              See what the hull took from the Library
            </Link>
          </p>
        </Alert>
      )}
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        <SelectField
          label="Hull"
          value={hullId}
          error={missingHull && !hullId ? 'Choose the hull to take it into' : undefined}
          onChange={(e) => {
            setHullId(e.target.value);
            setMissingHull(false);
          }}
        >
          <option value="">Choose a hull…</option>
          {hulls.data?.map((h) => (
            <option key={h.id} value={String(h.id)}>
              {h.name}
            </option>
          ))}
        </SelectField>
        <SelectField label="Revision" value={revisionId} onChange={(e) => setRevisionId(e.target.value)}>
          {item.revisions.map((r) => (
            <option key={r.id} value={String(r.id)}>
              {`Revision ${r.number}${r.id === item.latest.id ? ' (newest)' : ''}`}
            </option>
          ))}
        </SelectField>
      </div>
      <div>
        <Button type="submit" busy={take.isPending}>
          Take into hull
        </Button>
      </div>
    </form>
  );
}
