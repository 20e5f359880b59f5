import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import { completePasswordResetSchema } from '../../../../shared/api/collaboration';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { InputField } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { ApiError, describeError } from '../../../lib/api-client';
import { showServerError } from '../../../lib/form-errors';
import { useCompletePasswordReset } from '../api/complete-password-reset';
import { usePasswordResetPreview } from '../api/preview-password-reset';

const link = 'inline-flex min-h-11 items-center font-semibold text-primary underline underline-offset-4';
const formSchema = completePasswordResetSchema.pick({ password: true });
type Values = z.infer<typeof formSchema>;

/** The page a reset link opens: choose the new password; then every session of the account ends. */
export function ResetPasswordForm({ token }: { token: string }) {
  const preview = usePasswordResetPreview(token);
  const complete = useCompletePasswordReset();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Values>({ resolver: zodResolver(formSchema), defaultValues: { password: '' } });

  if (complete.isSuccess) {
    return (
      <Alert tone="ok" title="Your new password is set.">
        <p>{complete.data.message}</p>
        <Link to="/sign-in" className={link}>
          Sign in
        </Link>
      </Alert>
    );
  }
  if (preview.isPending) return <Loading label="Reading the link…" />;
  if (preview.isError) {
    return (
      <Alert tone="error" title={preview.error instanceof ApiError && preview.error.status < 500 ? 'This link cannot be used.' : 'The link could not be read.'}>
        <p>{describeError(preview.error)}</p>
        <Link to="/forgot-password" className={link}>
          Ask for a new link
        </Link>
      </Alert>
    );
  }
  const submit = handleSubmit(async (values) => {
    try {
      await complete.mutateAsync({ token, password: values.password });
    } catch (error) {
      showServerError(error, setError, ['password']);
    }
  });
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-5">
      <p>
        For the account <strong>{preview.data.email}</strong>. Choosing it signs the account out everywhere.
      </p>
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      <InputField label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.password?.message} {...register('password')} />
      <Button type="submit" busy={isSubmitting}>
        Set the new password
      </Button>
    </form>
  );
}
