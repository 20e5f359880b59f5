import { useEffect, useState } from 'react';
import { useLocation } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { Loading } from '../../components/ui/loading';
import { useSession } from '../../features/auth/api/get-session';
import { AcceptInvitation } from '../../features/invitations/components/accept-invitation';

const KEPT = 'loftbench.invitation';

/**
 * `/invitation#<token>`: the page the link in an invitation opens. The token stays out of every URL the
 * server sees: it is in the fragment, and kept in this tab's session storage while the person goes to
 * sign in and comes back to `/invitation`.
 */
export function InvitationRoute() {
  const { hash } = useLocation();
  const session = useSession();
  const [token] = useState(() => {
    const fromLink = hash.replace(/^#/, '');
    if (fromLink) sessionStorage.setItem(KEPT, fromLink);
    return fromLink || sessionStorage.getItem(KEPT) || '';
  });
  // Once the token is kept, take it out of the address bar (and so out of the browser's history).
  useEffect(() => {
    if (hash) window.history.replaceState(window.history.state, '', window.location.pathname);
  }, [hash]);

  return (
    <div className="mx-auto flex max-w-2xl flex-col gap-5">
      <title>Invitation · Loftbench</title>
      <h1 className="text-3xl font-bold tracking-tight">An invitation to a crew</h1>
      {!token ? (
        <Alert tone="error" title="This link is incomplete.">
          Open the link from the e-mail again, or copy the whole address into the browser.
        </Alert>
      ) : session.isPending ? (
        <Loading label="Checking who is signed in…" />
      ) : (
        <AcceptInvitation token={token} user={session.data?.user ?? null} here="/invitation" onAccepted={() => sessionStorage.removeItem(KEPT)} />
      )}
    </div>
  );
}
