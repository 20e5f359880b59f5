import { Card } from '../../components/ui/card';
import { SignUpForm } from '../../features/auth/components/sign-up-form';

export function SignUpRoute() {
  return (
    <div className="mx-auto flex max-w-md flex-col gap-5">
      <title>Create an account · Loftbench</title>
      <div className="flex flex-col gap-1">
        <h1 className="text-3xl font-bold tracking-tight">Create your Loftbench account</h1>
        <p className="text-lg text-muted">One account for all the hulls you build, design or help on.</p>
      </div>
      <Card>
        <SignUpForm />
      </Card>
    </div>
  );
}
