import Link from 'next/link';
import { getPageOrgContext } from '@/lib/server/page-context';
import { can } from '@/lib/server/permissions';
import { organisationReadOnlyReason } from '@/lib/server/org-context';
import { ROLE_LABELS } from '@/lib/server/permissions';
import type { NavItem } from '@/components/shell/org-nav';
import { OrgShell } from '@/components/shell/org-shell';
import { signOutAction } from '@/app/orgs/actions';
import { SignOutForm } from '@/components/offline/sign-out-form';
import { OfflineSupport } from '@/components/offline/offline-support';

export default async function OrgLayout({ children, params }: { children: React.ReactNode; params: Promise<{ org: string }> }) {
  const { org } = await params;
  const ctx = await getPageOrgContext(org);
  const base = `/o/${org}`;
  const readOnly = organisationReadOnlyReason(ctx.organisation);
  const items: NavItem[] = [
    { href: base, label: 'Fleet overview' },
    { href: `${base}/register`, label: 'Anode register' },
    { href: `${base}/designs`, label: 'Design desk' },
    { href: `${base}/dockings`, label: 'Docking planner' },
    { href: `${base}/surveys`, label: 'Surveys' },
    { href: `${base}/catalogue`, label: 'Catalogue' },
  ];
  if (can(ctx.role, 'team:manage')) items.push({ href: `${base}/team`, label: 'Team' });
  if (can(ctx.role, 'billing:manage')) items.push({ href: `${base}/billing`, label: 'Billing' });
  if (can(ctx.role, 'audit:read')) items.push({ href: `${base}/audit`, label: 'Audit log' });
  items.push({ href: `${base}/account`, label: 'My account' });
  const banner = readOnly ? (
    <div role="alert" className="no-print mb-4 rounded-[3px] border border-state-action/40 bg-state-actionbg px-4 py-2 text-sm text-state-action">
      <strong>Read-only.</strong> {readOnly} You can read, print and export everything; nothing has been deleted.{' '}
      {can(ctx.role, 'billing:manage') ? (
        <Link href={`${base}/billing`} className="font-semibold underline">
          Renew the subscription
        </Link>
      ) : (
        'An owner of the organisation can renew the subscription.'
      )}
    </div>
  ) : null;
  const signOut = <SignOutForm action={signOutAction} buttonClassName="mt-1 text-left text-tide-300 hover:text-white hover:underline max-lg:min-h-11 max-lg:text-sm" />;
  return (
    <OrgShell organisationName={ctx.organisation.name} userName={ctx.user.name} roleLabel={ROLE_LABELS[ctx.role]} items={items} signOut={signOut} banner={banner}>
      <OfflineSupport userId={ctx.user.id} renderedAt={new Date().toISOString()} />
      {children}
    </OrgShell>
  );
}
