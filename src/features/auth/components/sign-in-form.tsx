import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { signInSchema, type SignInInput } from '../../../../shared/api/auth';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { InputField } from '../../../components/ui/field';
import { showServerError, type ErrorWords } from '../../../lib/form-errors';
import { safeNext } from '../../../lib/safe-next';
import { useSignIn } from '../api/sign-in';

const words: ErrorWords<SignInInput> = {
  bad_credentials: { message: 'That e-mail and password do not match an account. Check both and try again.' },
  too_many_attempts: { message: 'Too many tries in a short time. Wait a few minutes, then try again.' },
};

export function SignInForm() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const signIn = useSignIn();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SignInInput>({ resolver: zodResolver(signInSchema), defaultValues: { email: '', password: '' } });

  const next = params.get('next');
  const onSubmit = handleSubmit(async (values) => {
    try {
      await signIn.mutateAsync(values);
    } catch (error) {
      showServerError(error, setError, ['email', 'password'], words);
      return;
    }
    await navigate(safeNext(next), { replace: true });
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      <InputField label="E-mail" type="email" autoComplete="email" inputMode="email" error={errors.email?.message} {...register('email')} />
      <InputField label="Password" type="password" autoComplete="current-password" error={errors.password?.message} {...register('password')} />
      <Button type="submit" busy={isSubmitting}>
        Sign in
      </Button>
      <p className="text-muted">
        New to Loftbench?{' '}
        <Link to={next ? `/sign-up?next=${encodeURIComponent(next)}` : '/sign-up'} className="inline-flex min-h-11 items-center font-semibold text-primary underline underline-offset-4">
          Create an account
        </Link>
      </p>
      <p className="text-muted">
        <Link to="/forgot-password" className="inline-flex min-h-11 items-center font-semibold text-primary underline underline-offset-4">
          Forgot your password?
        </Link>
      </p>
    </form>
  );
}
