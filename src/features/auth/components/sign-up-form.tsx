import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { signUpSchema, type SignUpInput } from '../../../../shared/api/auth';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { InputField } from '../../../components/ui/field';
import { showServerError, type ErrorWords } from '../../../lib/form-errors';
import { safeNext } from '../../../lib/safe-next';
import { useSignUp } from '../api/sign-up';

const words: ErrorWords<SignUpInput> = {
  email_taken: { field: 'email', message: 'There is already an account with this e-mail. Sign in instead, or use another e-mail.' },
  too_many_attempts: { message: 'Too many tries in a short time. Wait a few minutes, then try again.' },
};

export function SignUpForm() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const signUp = useSignUp();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm({ resolver: zodResolver(signUpSchema), defaultValues: { displayName: '', email: '', password: '' } });

  const next = params.get('next');
  const onSubmit = handleSubmit(async (values) => {
    try {
      await signUp.mutateAsync(values);
    } catch (error) {
      showServerError(error, setError, ['displayName', 'email', 'password'], words);
      return;
    }
    await navigate(safeNext(next), { replace: true });
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-5">
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      <InputField label="Your name" hint="Shown to the crew of the hulls you work on." autoComplete="name" error={errors.displayName?.message} {...register('displayName')} />
      <InputField label="E-mail" type="email" autoComplete="email" inputMode="email" error={errors.email?.message} {...register('email')} />
      <InputField label="Password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.password?.message} {...register('password')} />
      <Button type="submit" busy={isSubmitting}>
        Create account
      </Button>
      <p className="text-muted">
        Already have an account?{' '}
        <Link to={next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'} className="inline-flex min-h-11 items-center font-semibold text-primary underline underline-offset-4">
          Sign in instead
        </Link>
      </p>
    </form>
  );
}
