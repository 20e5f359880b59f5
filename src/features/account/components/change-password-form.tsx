import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { changePasswordSchema, type ChangePasswordInput } from '../../../../shared/api/collaboration';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { InputField } from '../../../components/ui/field';
import { showServerError } from '../../../lib/form-errors';
import { useChangePassword } from '../api/change-password';

type Values = { currentPassword: string; newPassword: string; signOutOthers: boolean };

/** Change one's password while signed in, signing out every other browser unless asked not to. */
export function ChangePasswordForm() {
  const change = useChangePassword();
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<ChangePasswordInput, unknown, Values>({ resolver: zodResolver(changePasswordSchema), defaultValues: { currentPassword: '', newPassword: '', signOutOthers: true } });
  const submit = handleSubmit(async (values) => {
    try {
      await change.mutateAsync(values);
      reset({ currentPassword: '', newPassword: '', signOutOthers: values.signOutOthers });
    } catch (error) {
      showServerError(error, setError, ['currentPassword', 'newPassword']);
    }
  });
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-5" aria-labelledby="password-heading">
      <h2 id="password-heading" className="text-xl font-bold">
        Change your password
      </h2>
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      {change.isSuccess && <Alert tone="ok">{change.data.message}</Alert>}
      <InputField label="Present password" type="password" autoComplete="current-password" error={errors.currentPassword?.message} {...register('currentPassword')} />
      <InputField label="New password" type="password" autoComplete="new-password" hint="At least 10 characters." error={errors.newPassword?.message} {...register('newPassword')} />
      <label className="flex min-h-12 items-center gap-3">
        <input type="checkbox" className="size-5" {...register('signOutOthers')} />
        Sign out everywhere else (other browsers, a tablet left in the shop)
      </label>
      <div>
        <Button type="submit" busy={isSubmitting}>
          Change password
        </Button>
      </div>
    </form>
  );
}
