import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { PinCompare } from '../../features/library/components/pin-compare';
import { StayButton } from '../../features/notices/components/stay-button';
import { getPlanQueryOptions } from '../../features/plan/api/get-plan';
import { openSnapshot } from '../../features/plan/editor/initial-snapshot';
import { jsonEqual } from '../../features/plan/editor/plan-update';
import { usePlanEditorState } from '../../features/plan/hooks/use-plan-editor';
import { useHullOutlet } from './hull';

const positive = (raw: string | null | undefined) => (raw && /^\d+$/.test(raw) && Number(raw) > 0 ? Number(raw) : null);

/**
 * `/hulls/:hullId/library/:pinId/compare?to=<revision>&notice=<id>`: the pinned revision against a
 * newer one, and the choice to move the hull or stay.
 */
export function HullPinCompareRoute() {
  const { hull } = useHullOutlet();
  const params = useParams();
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const editor = usePlanEditorState();
  const pinId = positive(params.pinId);
  const to = positive(search.get('to'));
  const noticeId = positive(search.get('notice'));
  if (!pinId || !to) return <Alert tone="error" title="This comparison address is incomplete." />;

  // The move is a new revision saved by the server: an editor holding no changes of its own is brought up
  // to it at once; one with changes keeps them, and its next save meets the new revision as a conflict.
  const bringEditorUp = async () => {
    if (editor.state !== 'ready') return;
    const state = editor.store.getState();
    if (!state.basePlan || !jsonEqual(state.plan, state.basePlan)) return;
    const latest = await queryClient.fetchQuery({ ...getPlanQueryOptions(hull.id), staleTime: 0 });
    const opened = openSnapshot(latest, null);
    if (opened.ok) state.load(opened.snapshot);
  };

  return (
    <div className="flex flex-col gap-4">
      <title>{`Compare revisions · ${hull.name} · Loftbench`}</title>
      <PinCompare
        hullId={hull.id}
        pinId={pinId}
        toRevisionId={to}
        canMove={hull.role !== 'helper'}
        onMoved={bringEditorUp}
        moreActions={(data) => noticeId !== null && <StayButton noticeId={noticeId} revisionNumber={data.from.number} onStayed={() => void navigate('/notices')} />}
      />
      <Link to={`/hulls/${hull.id}/library`} className="inline-flex min-h-12 items-center font-semibold text-primary underline underline-offset-4">
        Back to what this hull took from the Library
      </Link>
    </div>
  );
}
