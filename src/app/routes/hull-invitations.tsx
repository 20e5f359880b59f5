import { Card } from '../../components/ui/card';
import { InviteForm } from '../../features/invitations/components/invite-form';
import { PendingInvitations } from '../../features/invitations/components/pending-invitations';
import { useHullOutlet } from './hull';

/** `/hulls/:hullId/invitations`: the owner invites people by e-mail and sees who has not answered yet. */
export function HullInvitationsRoute() {
  const { hull } = useHullOutlet();
  return (
    <section aria-labelledby="invitations-heading" className="flex flex-col gap-6">
      <title>{`Invitations · ${hull.name} · Loftbench`}</title>
      <h2 id="invitations-heading" className="text-2xl font-bold">
        Invitations
      </h2>
      {hull.role === 'owner' ? (
        <>
          <Card>
            <InviteForm hullId={hull.id} />
          </Card>
          <PendingInvitations hullId={hull.id} />
        </>
      ) : (
        <p className="text-lg">Only an owner of this hull invites people to its crew. Ask one of them.</p>
      )}
    </section>
  );
}
