import { Button } from '../../../components/ui/button';
import { describeError } from '../../../lib/api-client';
import { useDismissNotice } from '../api/dismiss-notice';

/** Stay on the pinned revision: the notice goes away (it comes back for a still newer revision). */
export function StayButton({ noticeId, revisionNumber, onStayed }: { noticeId: number; revisionNumber: number; onStayed?: () => void }) {
  const dismiss = useDismissNotice();
  return (
    <span className="inline-flex flex-wrap items-center gap-3">
      <Button variant="secondary" busy={dismiss.isPending} onClick={() => dismiss.mutate(noticeId, { onSuccess: onStayed })}>
        Stay on revision {revisionNumber}
      </Button>
      {dismiss.isError && (
        <span role="alert" className="font-medium text-danger">
          {describeError(dismiss.error)}
        </span>
      )}
    </span>
  );
}
