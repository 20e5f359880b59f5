import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { requestPasswordResetSchema, type RequestPasswordResetInput } from '../../../../shared/api/collaboration';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { InputField } from '../../../components/ui/field';
import { showServerError, type ErrorWords } from '../../../lib/form-errors';
import { useRequestPasswordReset } from '../api/request-password-reset';

const words: ErrorWords<RequestPasswordResetInput> = {
  too_many_attempts: { message: 'Too many requests in a short time. Wait a few minutes, then try again.' },
};

/** Ask for a link to choose a new password. The answer is the same whether or not the address has an account. */
export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<RequestPasswordResetInput>({ resolver: zodResolver(requestPasswordResetSchema), defaultValues: { email: '' } });
  const submit = handleSubmit(async (values) => {
    try {
      await request.mutateAsync(values);
    } catch (error) {
      showServerError(error, setError, ['email'], words);
    }
  });
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-5">
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      {request.isSuccess && (
        <Alert tone="ok" title="Check your mail.">
          {request.data.message} The link works once, for an hour.
        </Alert>
      )}
      <InputField label="E-mail" type="email" autoComplete="email" inputMode="email" error={errors.email?.message} {...register('email')} />
      <Button type="submit" busy={isSubmitting}>
        Send me a link
      </Button>
    </form>
  );
}
