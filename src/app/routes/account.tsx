import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { useSession } from '../../features/auth/api/get-session';
import { ChangePasswordForm } from '../../features/account/components/change-password-form';
import { NoticeMailSetting } from '../../features/account/components/notice-mail-setting';

/** `/account`: the signed-in person's password and settings. */
export function AccountRoute() {
  const session = useSession();
  const user = session.data?.user;
  return (
    <div className="flex max-w-2xl flex-col gap-6">
      <title>Account · Loftbench</title>
      <PageHeader title="Your account" lead={user ? `${user.displayName}, ${user.email}` : undefined} />
      <Card>
        <NoticeMailSetting />
      </Card>
      <Card>
        <ChangePasswordForm />
      </Card>
    </div>
  );
}
