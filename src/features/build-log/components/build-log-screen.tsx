import { useSearchParams } from 'react-router-dom';
import type { Role } from '../../../../shared/api/hulls';
import { Alert } from '../../../components/ui/alert';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { useBuildBoard } from '../api/get-build-board';
import { BuildBoard } from './build-board';
import { PartPanel } from './part-panel';
import { ToleranceForm } from './tolerance-form';

/** The Build log tab: the board of the hull beside the chosen part. The designer sees it without the buttons. */
export function BuildLogScreen({ hullId, role, userId }: { hullId: number; role: Role; userId: number | null }) {
  const board = useBuildBoard(hullId);
  const [params, setParams] = useSearchParams();
  const selected = params.get('part');
  if (board.isPending) return <Loading label="Loading the build log…" />;
  if (board.isError) return <Alert tone="error">{describeError(board.error)}</Alert>;
  const canKeep = role !== 'designer';
  return (
    <div className="flex flex-col gap-6">
      {!canKeep && <p className="text-muted">You can read the build log; the owner, builders and helpers keep it.</p>}
      {board.data.parts.length === 0 ? (
        <p>The plan has no parts yet. Add frames on the Frames tab and they appear here.</p>
      ) : (
        <BuildBoard board={board.data} selected={selected} onSelect={(partId) => setParams({ part: partId }, { replace: true })} />
      )}
      {selected && <PartPanel key={selected} hullId={hullId} partId={selected} role={role} userId={userId} />}
      {/* Who may set it is the server's rule: those who may change the parts. */}
      {(role === 'owner' || role === 'builder') && <ToleranceForm hullId={hullId} toleranceMm={board.data.moveToleranceMm} notation={board.data.notation} />}
    </div>
  );
}
