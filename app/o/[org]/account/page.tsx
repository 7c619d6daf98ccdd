import type { Metadata } from 'next';
import { getPageOrgContext } from '@/lib/server/page-context';
import { PageHeader, Panel } from '@/components/ui/panel';
import { ChangePasswordForm } from '@/components/auth/change-password-form';

export const metadata: Metadata = { title: 'My account' };

export default async function AccountPage({ params }: { params: Promise<{ org: string }> }) {
  const { org } = await params;
  const ctx = await getPageOrgContext(org);
  return (
    <>
      <PageHeader title="My account" subtitle={`${ctx.user.name} · ${ctx.user.email}`} />
      <Panel title="Change password">
        <ChangePasswordForm />
      </Panel>
    </>
  );
}
