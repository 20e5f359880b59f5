import { Link } from 'react-router-dom';
import { Card } from '../../components/ui/card';
import { ForgotPasswordForm } from '../../features/account/components/forgot-password-form';

/** `/forgot-password`: ask for a link to choose a new password. */
export function ForgotPasswordRoute() {
  return (
    <div className="mx-auto flex max-w-md flex-col gap-5">
      <title>Forgotten password · Loftbench</title>
      <div className="flex flex-col gap-1">
        <h1 className="text-3xl font-bold tracking-tight">Choose a new password</h1>
        <p className="text-lg text-muted">Give the e-mail address of your account; a link to choose a new password goes to it.</p>
      </div>
      <Card>
        <ForgotPasswordForm />
      </Card>
      <Link to="/sign-in" className="inline-flex min-h-12 items-center font-semibold text-primary underline underline-offset-4">
        Back to sign in
      </Link>
    </div>
  );
}
