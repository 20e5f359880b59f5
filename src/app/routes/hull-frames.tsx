import { RequireEditor } from '../../features/plan/components/plan-bar';
import { FramesScreen } from '../../features/plan/components/frames/frames-screen';

/** `/hulls/:hullId/frames`: the parts and their results. */
export function HullFramesRoute() {
  return (
    <RequireEditor>
      <FramesScreen />
    </RequireEditor>
  );
}
