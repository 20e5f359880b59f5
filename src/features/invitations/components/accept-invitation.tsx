import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link, useNavigate } from 'react-router-dom';
import { z } from 'zod';
import { acceptInvitationSchema, type InvitationPreview } from '../../../../shared/api/collaboration';
import type { SessionUser } from '../../../../shared/api/auth';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { InputField } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { ApiError, describeError } from '../../../lib/api-client';
import { showServerError, type ErrorWords } from '../../../lib/form-errors';
import { formatWhen, roleLabels } from '../../../lib/labels';
import { signInPath } from '../../../lib/safe-next';
import { useAcceptInvitation } from '../api/accept-invitation';
import { useInvitationPreview } from '../api/preview-invitation';

const link = 'inline-flex min-h-11 items-center font-semibold text-primary underline underline-offset-4';

const newAccountSchema = acceptInvitationSchema.shape.newAccount.unwrap();
type NewAccount = z.infer<typeof newAccountSchema>;

const words: ErrorWords<NewAccount> = {
  email_taken: { message: 'There is already an account with this e-mail address. Sign in with it (below), then this page lets you accept.' },
};

function What({ preview }: { preview: InvitationPreview }) {
  return (
    <p className="text-lg">
      <strong>{preview.invitedByName}</strong> invites <strong>{preview.email}</strong> onto the crew of <strong>{preview.hullName}</strong> as{' '}
      <strong>{roleLabels[preview.role]}</strong>. The link works until {formatWhen(preview.expiresAt)}.
    </p>
  );
}

function NewAccountForm({ token, here, onAccepted }: { token: string; here: string; onAccepted?: () => void }) {
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<NewAccount>({ resolver: zodResolver(newAccountSchema), defaultValues: { displayName: '', password: '' } });
  const submit = handleSubmit(async (values) => {
    try {
      const done = await accept.mutateAsync({ token, newAccount: values });
      onAccepted?.();
      await navigate(`/hulls/${done.hullId}`, { replace: true });
    } catch (error) {
      showServerError(error, setError, ['displayName', 'password'], words);
    }
  });
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-4" aria-labelledby="new-account-heading">
      <h2 id="new-account-heading" className="text-xl font-bold">
        New to Loftbench? Make your account
      </h2>
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      <InputField label="Your name" hint="Shown to the crew." autoComplete="name" error={errors.displayName?.message} {...register('displayName')} />
      <InputField label="Choose a password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.password?.message} {...register('password')} />
      <div>
        <Button type="submit" busy={isSubmitting}>
          Make my account and join the crew
        </Button>
      </div>
      <p className="text-muted">
        Have an account already?{' '}
        <Link to={signInPath(here)} className={link}>
          Sign in to accept
        </Link>
      </p>
    </form>
  );
}

function AcceptAsMe({ token, user, onAccepted }: { token: string; user: SessionUser; onAccepted?: () => void }) {
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  return (
    <div className="flex flex-col gap-3">
      <p>You are signed in as <strong>{user.displayName}</strong> ({user.email}). Accepting puts this account on the crew.</p>
      {accept.isError && <Alert tone="error">{describeError(accept.error)}</Alert>}
      <div>
        <Button
          busy={accept.isPending}
          onClick={() =>
            accept.mutate(
              { token },
              {
                onSuccess: (done) => {
                  onAccepted?.();
                  void navigate(`/hulls/${done.hullId}`, { replace: true });
                },
              },
            )
          }
        >
          Accept and join the crew
        </Button>
      </div>
    </div>
  );
}

/** The page a link in an invitation mail opens: what it is, then accept (signed in) or make an account. */
export function AcceptInvitation({ token, user, here, onAccepted }: { token: string; user: SessionUser | null; here: string; onAccepted?: () => void }) {
  const preview = useInvitationPreview(token);
  if (preview.isPending) return <Loading label="Reading the invitation…" />;
  if (preview.isError) {
    const gone = preview.error instanceof ApiError && (preview.error.status === 410 || preview.error.status === 404 || preview.error.status === 400);
    return (
      <Alert tone="error" title={gone ? 'This invitation cannot be used.' : 'The invitation could not be read.'}>
        <p>{describeError(preview.error)}</p>
      </Alert>
    );
  }
  return (
    <Card className="flex flex-col gap-5">
      <What preview={preview.data.invitation} />
      {user ? <AcceptAsMe token={token} user={user} onAccepted={onAccepted} /> : <NewAccountForm token={token} here={here} onAccepted={onAccepted} />}
    </Card>
  );
}
