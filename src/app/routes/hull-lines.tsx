import { RequireEditor } from '../../features/plan/components/plan-bar';
import { LinesScreen } from '../../features/plan/components/lines/lines-screen';

/** `/hulls/:hullId/lines`: the table of offsets. */
export function HullLinesRoute() {
  return (
    <RequireEditor>
      <LinesScreen />
    </RequireEditor>
  );
}
