import Link from 'next/link';
import { getPageOrgContext } from '@/lib/server/page-context';
import { can } from '@/lib/server/permissions';
import { organisationReadOnlyReason } from '@/lib/server/org-context';
import { ROLE_LABELS } from '@/lib/server/permissions';
import { OrgNav, type NavItem } from '@/components/shell/org-nav';
import { signOutAction } from '@/app/orgs/actions';

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
  return (
    <div className="flex min-h-screen">
      <aside className="no-print flex w-56 shrink-0 flex-col gap-5 bg-tide-900 px-3 py-4 text-tide-100">
        <Link href="/orgs" className="px-2 text-lg font-semibold tracking-tight text-white">
          Tidewarden
        </Link>
        <div className="px-2">
          <p className="text-2xs uppercase tracking-[0.16em] text-tide-300">Organisation</p>
          <p className="text-sm font-medium text-white">{ctx.organisation.name}</p>
          <Link href="/orgs" className="text-2xs text-tide-300 hover:underline">
            Switch organisation
          </Link>
        </div>
        <OrgNav items={items} />
        <div className="mt-auto border-t border-tide-700 px-2 pt-3 text-xs">
          <p className="text-white">{ctx.user.name}</p>
          <p className="text-tide-300">{ROLE_LABELS[ctx.role]}</p>
          <form action={signOutAction}>
            <button type="submit" className="mt-1 text-tide-300 hover:text-white hover:underline">
              Sign out
            </button>
          </form>
        </div>
      </aside>
      <main className="min-w-0 flex-1 px-8 py-6">
        {readOnly ? (
          <div role="alert" className="no-print mb-4 rounded-[3px] border border-state-overdue/40 bg-state-overduebg px-4 py-2 text-sm text-state-overdue">
            <strong>Read-only.</strong> {readOnly} You can read, print and export everything; nothing has been deleted.{' '}
            {can(ctx.role, 'billing:manage') ? (
              <Link href={`${base}/billing`} className="font-semibold underline">
                Renew the subscription
              </Link>
            ) : (
              'An owner of the organisation can renew the subscription.'
            )}
          </div>
        ) : null}
        {children}
      </main>
    </div>
  );
}
