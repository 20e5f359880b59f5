import { Send } from 'lucide-react';
import { createInvitationSchema } from '../../../../shared/api/collaboration';
import { EmailRoleForm, type EmailRoleFormProps } from '../../../components/forms/email-role-form';
import { roleLabels } from '../../../lib/labels';
import { useCreateInvitation } from '../api/create-invitation';

const words: EmailRoleFormProps['words'] = {
  already_member: { field: 'email', message: 'This person is on the crew already.' },
  mail_not_sent: { message: 'The mail server did not take the invitation, so nothing was sent. Try again in a moment.' },
  mail_not_configured: { message: 'This Loftbench cannot send e-mail (no mail server is set up). Ask whoever runs it.' },
};

/** The owner invites someone, by e-mail, who may have no account yet; the link in the mail works once, for 7 days. */
export function InviteForm({ hullId }: { hullId: number }) {
  const invite = useCreateInvitation(hullId);
  return (
    <EmailRoleForm
      schema={createInvitationSchema}
      heading={{ id: 'invite-heading', text: 'Invite by e-mail', level: 2 }}
      intro="For someone with no Loftbench account yet (or one you do not know). They get a link that works once, for 7 days; with it they make an account, or sign in, and join the crew."
      emailLabel="Their e-mail"
      roleLabel="Role on this hull"
      submit={{ label: 'Send invitation', icon: <Send aria-hidden="true" className="size-5" /> }}
      words={words}
      send={async (values) => {
        const { invitation } = await invite.mutateAsync(values);
        return `Invitation sent to ${invitation.email}, as ${roleLabels[invitation.role]}.`;
      }}
    />
  );
}
