import type { Metadata } from 'next';
import Link from 'next/link';
import { ButtonLink } from '@/components/ui/button';
import { getCurrentUser } from '@/lib/server/auth/session';
import { CAUTION_SENTENCE } from '@/lib/labels';
import { PUBLIC_METADATA } from './public-metadata';

export const metadata: Metadata = PUBLIC_METADATA;

const STEPS = [
  {
    title: 'Size the anodes',
    text: 'Enter the hull bottom, boot-top, rudder, propeller and sea chests, or the immersed and mud zones of a jetty’s piles. Tidewarden takes the design current density by water and temperature, the coating breakdown factor over the design life, the alloy’s electrochemical capacity and utilisation factor, and gives the net anode mass, the anode resistance and current output, and the count that meets every criterion, with the governing one named.',
  },
  {
    title: 'Keep the register',
    text: 'Every installed anode group with its model, quantity and positions (frame numbers, or pile bent and letter), and every diver, drop-cell or ROV survey: potentials converted to one reference electrode and checked against the protection criteria, remaining anode fractions, photos and reports.',
  },
  {
    title: 'Plan the renewals',
    text: 'Forecast when each group reaches its utilisation factor, book renewals against the next dry-docking or diving campaign, and print the dry-dock anode list the yard orders and fits from. Reminders go out before each docking.',
  },
];

const BASIS = ['DNV-RP-B401 (2010) current densities, coating breakdown, anode resistance', 'EN 12473 general principles', 'ISO 20313 ship hulls', 'ISO 13174 harbour installations'];

export default async function LandingPage() {
  const user = await getCurrentUser();
  return (
    <div className="min-h-screen">
      <header className="border-b border-rule bg-paper-raised">
        <div className="mx-auto flex max-w-5xl flex-wrap items-center justify-between gap-2 px-4 py-3 sm:px-6">
          <span className="text-lg font-semibold tracking-tight text-tide-700">Tidewarden</span>
          <nav className="flex items-center gap-2 text-sm">
            {user ? (
              <ButtonLink href="/orgs">Open my organisations</ButtonLink>
            ) : (
              <>
                <Link href="/sign-in" className="px-2 text-tide-600 hover:underline">
                  Sign in
                </Link>
                <ButtonLink href="/sign-up">Create an account</ButtonLink>
              </>
            )}
          </nav>
        </div>
      </header>
      <main id="content" tabIndex={-1} className="mx-auto max-w-5xl px-4 py-12 outline-none sm:px-6">
        <p className="text-xs font-semibold uppercase tracking-[0.18em] text-brass-700">Sacrificial-anode cathodic protection</p>
        <h1 className="mt-2 max-w-3xl text-3xl font-semibold leading-tight text-ink">
          From the anode calculation to the list the yard fits at the next dry-docking.
        </h1>
        <p className="mt-4 max-w-3xl text-lg text-ink-soft">
          For naval architects and corrosion engineers who size zinc, aluminium and magnesium anodes for steel hulls and harbour piles, and for the port
          engineers, superintendents and yard planners who watch those anodes waste away and decide what to renew.
        </p>
        <div className="mt-10 grid gap-4 md:grid-cols-3">
          {STEPS.map((step, i) => (
            <section key={step.title} className="rounded-[4px] border border-rule bg-paper-raised p-5">
              <p className="num text-left text-xs text-ink-faint">0{i + 1}</p>
              <h2 className="mt-1 text-lg font-semibold text-tide-700">{step.title}</h2>
              <p className="mt-2 text-sm text-ink-soft">{step.text}</p>
            </section>
          ))}
        </div>
        <section className="mt-10 rounded-[4px] border border-rule bg-paper-sunk p-5">
          <h2 className="text-sm font-semibold text-ink">Published methods, named on every result</h2>
          <ul className="mt-2 grid gap-1 text-sm text-ink-soft md:grid-cols-2">
            {BASIS.map((b) => (
              <li key={b}>— {b}</li>
            ))}
          </ul>
          <p className="mt-3 text-xs text-ink-faint">{CAUTION_SENTENCE}</p>
        </section>
      </main>
    </div>
  );
}
