import { useNavigate, useParams } from 'react-router-dom';
import type { Camber } from '../../../shared/geometry/camber-schema';
import { Alert } from '../../components/ui/alert';
import { Card } from '../../components/ui/card';
import { Loading } from '../../components/ui/loading';
import { PageHeader } from '../../components/ui/page-header';
import { describeError } from '../../lib/api-client';
import { useLibraryItem } from '../../features/library/api/get-library-item';
import { usePublishRevision } from '../../features/library/api/publish-revision';
import { CamberForm } from '../../features/library/components/camber-form';
import { camberFormFrom } from '../../features/library/components/camber-form-values';
import { emptyLinesForm, LinesForm } from '../../features/library/components/lines-form';

function Revise({ itemId }: { itemId: number }) {
  const item = useLibraryItem(itemId);
  const publish = usePublishRevision(itemId);
  const navigate = useNavigate();
  if (item.isPending) return <Loading label="Loading…" />;
  if (item.isError) return <Alert tone="error" title="This could not be loaded.">{describeError(item.error)}</Alert>;
  const { latest, latestDocument, kind, mine } = item.data.item;
  if (!mine) return <Alert tone="error" title="Only its author publishes revisions of this item." />;
  const next = latest.number + 1;
  const done = () => navigate(`/library/${itemId}`, { replace: true });

  return (
    <div className="flex max-w-3xl flex-col gap-4">
      <title>{`Revision ${next} of ${latest.name} · Loftbench`}</title>
      <PageHeader title={`Revision ${next} of ${latest.name}`} lead={`Starts from revision ${latest.number}. Hulls that took an earlier revision are told, and choose whether to move.`} />
      <Card>
        {kind === 'camber' ? (
          <CamberForm
            initial={camberFormFrom({ name: latest.name, notes: latest.notes, rules: latest.rules, document: latestDocument as Camber })}
            withSharing={false}
            submitLabel={`Publish revision ${next}`}
            onSubmit={async ({ revision }) => {
              await publish.mutateAsync({ ...revision, baseRevisionId: latest.id });
              await done();
            }}
          />
        ) : (
          <LinesForm
            initial={{ ...emptyLinesForm, name: latest.name, notes: latest.notes, rules: latest.rules }}
            withSharing={false}
            submitLabel={`Publish revision ${next}`}
            onSubmit={async ({ revision }) => {
              await publish.mutateAsync({ ...revision, baseRevisionId: latest.id });
              await done();
            }}
          />
        )}
      </Card>
    </div>
  );
}

/** `/library/:itemId/revise`: the author publishes the next revision. */
export function LibraryReviseRoute() {
  const { itemId } = useParams();
  const id = Number(itemId);
  if (!/^\d+$/.test(itemId ?? '') || id <= 0) return <Alert tone="error" title="No such item in the Library." />;
  return <Revise key={id} itemId={id} />;
}
