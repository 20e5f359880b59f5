import { RequireEditor } from '../../features/plan/components/plan-bar';
import { DrawingScreen } from '../../features/plan/components/drawing/drawing-screen';

/** `/hulls/:hullId/drawing`: the lines and parts drawn, and the body plan edited by dragging. */
export function HullDrawingRoute() {
  return (
    <RequireEditor>
      <DrawingScreen />
    </RequireEditor>
  );
}
