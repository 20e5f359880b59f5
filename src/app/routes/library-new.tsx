import { useNavigate, useSearchParams } from 'react-router-dom';
import type { LibraryKind } from '../../../shared/api/library';
import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { usePublishItem } from '../../features/library/api/publish-item';
import { CamberForm } from '../../features/library/components/camber-form';
import { emptyCamberForm } from '../../features/library/components/camber-form-values';
import { emptyLinesForm, LinesForm } from '../../features/library/components/lines-form';

const choice = 'inline-flex min-h-12 items-center rounded-lg border-2 px-4 font-semibold';

/** `/library/new?kind=camber|lines`: publish a camber curve or the lines of a hull, as revision 1. */
export function LibraryNewRoute() {
  const [params, setParams] = useSearchParams();
  const kind: LibraryKind = params.get('kind') === 'lines' ? 'lines' : 'camber';
  const publish = usePublishItem();
  const navigate = useNavigate();
  const done = (id: number) => navigate(`/library/${id}`, { replace: true });

  return (
    <div className="flex max-w-3xl flex-col gap-4">
      <title>Publish to the Library · Loftbench</title>
      <PageHeader title="Publish to the Library" lead="Each publication is a revision that never changes; a later one is a new revision." />
      <div role="group" aria-label="What to publish" className="flex flex-wrap gap-2">
        {(['camber', 'lines'] as const).map((k) => (
          <button
            key={k}
            type="button"
            aria-pressed={kind === k}
            onClick={() => setParams({ kind: k }, { replace: true })}
            className={`${choice} ${kind === k ? 'border-primary bg-primary text-white' : 'border-edge bg-surface text-ink hover:bg-primary-soft'}`}
          >
            {k === 'camber' ? 'A camber curve' : 'Lines from a hull'}
          </button>
        ))}
      </div>
      <Card>
        {kind === 'camber' ? (
          <CamberForm
            initial={emptyCamberForm}
            withSharing
            submitLabel="Publish"
            onSubmit={async ({ revision, sharing }) => {
              const { item } = await publish.mutateAsync({ kind: 'camber', revision, sharing });
              await done(item.id);
            }}
          />
        ) : (
          <LinesForm
            initial={emptyLinesForm}
            withSharing
            submitLabel="Publish"
            onSubmit={async ({ revision, sharing }) => {
              const { item } = await publish.mutateAsync({ kind: 'lines', revision, sharing });
              await done(item.id);
            }}
          />
        )}
      </Card>
    </div>
  );
}
