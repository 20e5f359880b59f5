import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { formatWhen } from '../../../lib/labels';
import { useNotices } from '../api/get-notices';
import { StayButton } from './stay-button';

const kindWords = { camber: 'camber curve', lines: 'lines' } as const;

/** The person's open notices: a newer revision of something one of their hulls took from the Library. */
export function NoticesList() {
  const notices = useNotices();
  if (notices.isPending) return <Loading label="Loading your notices…" />;
  if (notices.isError) {
    return (
      <Alert tone="error" title="Your notices could not be loaded.">
        <p>{describeError(notices.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void notices.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  if (notices.data.notices.length === 0) return <p className="text-lg">Nothing new. When a designer publishes a newer revision of something one of your hulls took from the Library, it shows here.</p>;
  return (
    <ul className="flex flex-col gap-4">
      {notices.data.notices.map((n) => (
        <li key={n.id} className="flex flex-col gap-3 rounded-xl border-l-8 border-l-mark border-y border-r border-rule bg-surface p-5">
          <p className="text-lg">
            <strong>{n.authorName}</strong> published <strong>revision {n.newRevisionNumber}</strong> of the {kindWords[n.kind]} <strong>{n.itemName}</strong>.
            Your hull <strong>{n.hullName}</strong> follows revision {n.pinnedRevisionNumber}.
          </p>
          <p className="text-sm text-muted">{formatWhen(n.createdAt)}</p>
          <div className="flex flex-wrap items-center gap-3">
            <Link
              to={`/hulls/${n.hullId}/library/${n.pinId}/compare?to=${n.newRevisionId}&notice=${n.id}`}
              className="inline-flex min-h-12 items-center rounded-lg border-2 border-primary bg-primary px-5 font-semibold text-white hover:bg-primary-strong"
            >
              Compare and decide
            </Link>
            <StayButton noticeId={n.id} revisionNumber={n.pinnedRevisionNumber} />
          </div>
        </li>
      ))}
    </ul>
  );
}
