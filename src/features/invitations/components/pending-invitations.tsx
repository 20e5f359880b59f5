import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-client';
import { formatWhen, roleLabels } from '../../../lib/labels';
import { useInvitations } from '../api/get-invitations';
import { useRevokeInvitation } from '../api/revoke-invitation';

/** Invitations still waiting for an answer, each with a way to take it back. */
export function PendingInvitations({ hullId }: { hullId: number }) {
  const invitations = useInvitations(hullId);
  const revoke = useRevokeInvitation(hullId);
  if (invitations.isPending) return <Loading label="Loading the invitations…" />;
  if (invitations.isError) return <Alert tone="error" title="The invitations could not be loaded.">{describeError(invitations.error)}</Alert>;
  const list = invitations.data.invitations;
  return (
    <section aria-labelledby="pending-heading" className="flex flex-col gap-3">
      <h2 id="pending-heading" className="text-xl font-bold">
        Waiting for an answer
      </h2>
      {revoke.isError && <Alert tone="error">{describeError(revoke.error)}</Alert>}
      {list.length === 0 ? (
        <p className="text-muted">No invitation is waiting.</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {list.map((i) => (
            <li key={i.id} className="flex flex-wrap items-center justify-between gap-3 rounded-lg border border-rule bg-surface px-4 py-3">
              <span>
                <strong>{i.email}</strong> as {roleLabels[i.role]} · sent by {i.invitedByName} · works until {formatWhen(i.expiresAt)}
              </span>
              <Button variant="secondary" busy={revoke.isPending && revoke.variables === i.id} onClick={() => revoke.mutate(i.id)} aria-label={`Take back the invitation to ${i.email}`}>
                Take back
              </Button>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
