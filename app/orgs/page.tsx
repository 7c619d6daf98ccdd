import type { Metadata } from 'next';
import Link from 'next/link';
import { getEm } from '@/lib/server/db';
import { requireUser } from '@/lib/server/auth/session';
import { ROLE_LABELS } from '@/lib/server/permissions';
import { Panel } from '@/components/ui/panel';
import { CreateOrganisationForm, ResendVerificationForm } from '@/components/auth/orgs-forms';
import { signOutAction } from './actions';
import { SignOutForm } from '@/components/offline/sign-out-form';
import { SignedInMark } from '@/components/offline/signed-in-mark';
import { listMyOrganisations } from '@/lib/server/services/accounts/list-my-organisations';

export const metadata: Metadata = { title: 'Your organisations' };

export default async function OrgsPage({ searchParams }: { searchParams: Promise<{ verified?: string }> }) {
  const user = await requireUser('/orgs');
  const { verified } = await searchParams;
  const memberships = await listMyOrganisations(await getEm(), user);
  return (
    <div className="min-h-screen bg-paper-sunk">
      <SignedInMark userId={user.id} />
      <header className="border-b border-rule bg-paper-raised">
        <div className="mx-auto flex max-w-3xl flex-wrap items-center justify-between gap-2 px-3 py-3 sm:px-6">
          <Link href="/" className="text-lg font-semibold tracking-tight text-tide-700">
            Tidewarden
          </Link>
          <SignOutForm action={signOutAction} className="flex min-w-0 flex-wrap items-center gap-3 text-sm text-ink-soft" buttonClassName="inline-flex items-center justify-center rounded-[3px] border border-transparent px-3 py-1.5 text-sm font-medium text-tide-600 hover:bg-tide-50 max-lg:min-h-11">
            <span className="min-w-0 break-all">{user.email}</span>
          </SignOutForm>
        </div>
      </header>
      <main id="content" tabIndex={-1} className="mx-auto flex max-w-3xl flex-col gap-5 px-3 py-6 outline-none sm:px-6 sm:py-8">
        {verified ? <p role="status" className="rounded-[3px] border border-state-sound/40 bg-state-soundbg px-3 py-2 text-sm text-state-sound">Thank you: your e-mail address is confirmed.</p> : null}
        {!user.emailVerified ? (
          <Panel title="Confirm your e-mail address">
            <p className="mb-3 text-sm text-ink-soft">
              We sent a link to <strong>{user.email}</strong>. Open it to confirm the address; then you can create your organisation.
            </p>
            <ResendVerificationForm />
          </Panel>
        ) : null}
        <Panel title="Your organisations">
          {memberships.length ? (
            <ul className="divide-y divide-rule">
              {memberships.map((m) => (
                <li key={m.id} className="flex flex-wrap items-center justify-between gap-x-3 py-2">
                  <Link href={`/o/${m.organisation.slug}`} className="inline-flex min-h-11 items-center font-medium text-tide-600 hover:underline lg:min-h-0">
                    {m.organisation.name}
                  </Link>
                  <span className="text-xs text-ink-soft">{ROLE_LABELS[m.role]}</span>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-sm text-ink-soft">You are not a member of any organisation yet. Create one, or open an invitation you received by e-mail.</p>
          )}
        </Panel>
        {user.emailVerified ? (
          <Panel title="Create an organisation">
            <p className="mb-3 text-sm text-ink-soft">A ship owner or manager, a port authority or a CP consultancy: you become its owner and can invite your team.</p>
            <CreateOrganisationForm />
          </Panel>
        ) : null}
      </main>
    </div>
  );
}
