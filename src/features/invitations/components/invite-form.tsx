import { zodResolver } from '@hookform/resolvers/zod';
import { Send } from 'lucide-react';
import { useForm } from 'react-hook-form';
import { createInvitationSchema, type CreateInvitationInput } from '../../../../shared/api/collaboration';
import { roles } from '../../../../shared/api/hulls';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { InputField, SelectField } from '../../../components/ui/field';
import { showServerError, type ErrorWords } from '../../../lib/form-errors';
import { roleLabels } from '../../../lib/labels';
import { useCreateInvitation } from '../api/create-invitation';

const words: ErrorWords<CreateInvitationInput> = {
  already_member: { field: 'email', message: 'This person is on the crew already.' },
  mail_not_sent: { message: 'The mail server did not take the invitation, so nothing was sent. Try again in a moment.' },
  mail_not_configured: { message: 'This Loftbench cannot send e-mail (no mail server is set up). Ask whoever runs it.' },
};

/** The owner invites someone, by e-mail, who may have no account yet; the link in the mail works once, for 7 days. */
export function InviteForm({ hullId }: { hullId: number }) {
  const invite = useCreateInvitation(hullId);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<CreateInvitationInput>({ resolver: zodResolver(createInvitationSchema), defaultValues: { email: '', role: 'helper' } });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await invite.mutateAsync(values);
    } catch (error) {
      showServerError(error, setError, ['email', 'role'], words);
      return;
    }
    reset({ email: '', role: values.role });
  });
  const sent = invite.isSuccess ? invite.data.invitation : null;

  return (
    <form noValidate onSubmit={onSubmit} aria-labelledby="invite-heading" className="flex flex-col gap-4">
      <h2 id="invite-heading" className="text-xl font-bold">
        Invite by e-mail
      </h2>
      <p className="text-muted">For someone with no Loftbench account yet (or one you do not know). They get a link that works once, for 7 days; with it they make an account, or sign in, and join the crew.</p>
      {errors.root?.server && <Alert tone="error">{errors.root.server.message}</Alert>}
      {sent && (
        <Alert tone="ok">
          Invitation sent to {sent.email}, as {roleLabels[sent.role]}.
        </Alert>
      )}
      <div className="grid grid-cols-1 items-start gap-4 md:grid-cols-[minmax(0,1fr)_12rem_auto]">
        <InputField label="Their e-mail" type="email" inputMode="email" autoComplete="off" error={errors.email?.message} {...register('email')} />
        <SelectField label="Role on this hull" error={errors.role?.message} {...register('role')}>
          {roles.map((role) => (
            <option key={role} value={role}>
              {roleLabels[role]}
            </option>
          ))}
        </SelectField>
        <Button type="submit" busy={isSubmitting} className="md:mt-8">
          <Send aria-hidden="true" className="size-5" />
          Send invitation
        </Button>
      </div>
    </form>
  );
}
