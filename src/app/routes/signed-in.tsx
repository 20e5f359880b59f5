import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { describeError } from '../../lib/api-client';
import { signInPath } from '../../lib/safe-next';
import { useSession } from '../../features/auth/api/get-session';

/** The pages behind sign-in: a signed-out person goes to /sign-in and comes back here afterwards. */
export function SignedInRoute() {
  const session = useSession();
  const location = useLocation();

  if (session.data) {
    if (!session.data.user) return <Navigate to={signInPath(location.pathname + location.search + location.hash)} replace />;
    return <Outlet />;
  }
  if (session.isError) {
    return (
      <Alert tone="error" title="Loftbench could not check who is signed in.">
        <p>{describeError(session.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void session.refetch()}>
          Try again
        </Button>
      </Alert>
    );
  }
  return <Loading label="Checking who is signed in…" />;
}
