import { RequireEditor } from '../../features/plan/components/plan-bar';
import { HistoryScreen } from '../../features/plan/components/history/history-screen';

/** `/hulls/:hullId/history`: the revisions of the plan. */
export function HullHistoryRoute() {
  return (
    <RequireEditor>
      <HistoryScreen />
    </RequireEditor>
  );
}
