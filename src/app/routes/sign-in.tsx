import { useSearchParams } from 'react-router-dom';
import { Alert } from '../../components/ui/alert';
import { Card } from '../../components/ui/card';
import { SignInForm } from '../../features/auth/components/sign-in-form';

export function SignInRoute() {
  const [params] = useSearchParams();
  return (
    <div className="mx-auto flex max-w-md flex-col gap-5">
      <title>Sign in · Loftbench</title>
      <h1 className="text-3xl font-bold tracking-tight">Sign in to Loftbench</h1>
      {params.get('next') && <Alert tone="info">Sign in to carry on to the page you were going to.</Alert>}
      <Card>
        <SignInForm />
      </Card>
    </div>
  );
}
