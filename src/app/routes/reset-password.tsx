import { useEffect, useState } from 'react';
import { useLocation } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { Card } from '../../components/ui/card';
import { ResetPasswordForm } from '../../features/account/components/reset-password-form';

/**
 * `/reset-password#<token>`: the page the link in a reset mail opens. The token is in the fragment, which
 * never reaches a server log; once read it is taken out of the address bar (and so the browser's history).
 */
export function ResetPasswordRoute() {
  const { hash } = useLocation();
  const [token] = useState(() => hash.replace(/^#/, ''));
  useEffect(() => {
    if (hash) window.history.replaceState(window.history.state, '', window.location.pathname);
  }, [hash]);
  return (
    <div className="mx-auto flex max-w-md flex-col gap-5">
      <title>New password · Loftbench</title>
      <h1 className="text-3xl font-bold tracking-tight">Choose your new password</h1>
      {token ? (
        <Card>
          <ResetPasswordForm token={token} />
        </Card>
      ) : (
        <Alert tone="error" title="This link is incomplete.">
          Open the link from the e-mail again, or copy the whole address into the browser.
        </Alert>
      )}
    </div>
  );
}
