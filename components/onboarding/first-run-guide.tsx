import Link from 'next/link';
import type { FirstRun, FirstRunStep } from '@/lib/server/services/onboarding/get-first-run';

interface Step {
  key: FirstRunStep;
  title: string;
  detail: string;
  href: string | null;
  action: string;
}

function steps(org: string, { links }: FirstRun): Step[] {
  const structure = links.assetKind === 'structure';
  const asset = links.assetId ? `/o/${org}/assets/${links.assetId}` : null;
  return [
    {
      key: 'asset',
      title: 'Add a vessel or a structure',
      detail: 'From its particulars: a ship’s length, beam, draught and block coefficient, or a jetty’s piles and water.',
      href: '#add-asset',
      action: 'Add one below',
    },
    {
      key: 'design',
      title: 'Size its anodes on the design desk',
      detail: 'Zones, coating and life give the current and the anode count; a second engineer checks and approves the revision.',
      href: links.draftDesignId ? `/o/${org}/designs/${links.draftDesignId}` : `/o/${org}/designs`,
      action: links.draftDesignId ? 'Open the draft' : 'Open the design desk',
    },
    {
      key: 'fit',
      title: 'Fit the approved design',
      detail: 'Record its anodes as installed groups, so the register can forecast their depletion.',
      href: links.approvedDesignId ? `/o/${org}/designs/${links.approvedDesignId}` : null,
      action: 'Open the approved design',
    },
    {
      key: 'docking',
      title: structure ? 'Plan a campaign' : 'Plan a docking',
      detail: structure
        ? 'The next diving or works campaign, when the contractor can renew the anodes.'
        : 'The next dry-docking, when the yard can renew the anodes; the planner proposes which.',
      href: asset ? `/o/${org}/dockings` : null,
      action: structure ? 'Plan a campaign' : 'Plan a docking',
    },
  ];
}

/**
 * The first-run guide on the fleet page of a new organisation: four steps, each ticked as the
 * organisation's own records show it done, gone once all four are. Nothing is stored about the guide.
 */
export function FirstRunGuide({ org, progress }: { org: string; progress: FirstRun }) {
  if (progress.complete) return null;
  const list = steps(org, progress);
  const left = list.filter((s) => !progress.done[s.key]).length;
  const next = list.find((s) => !progress.done[s.key])?.key;
  return (
    <section aria-labelledby="first-run-title" className="rounded-[4px] border border-tide-300 bg-tide-50 px-4 py-3">
      <h2 id="first-run-title" className="text-sm font-semibold text-tide-700">
        Getting started: {left === 1 ? 'one step' : `${left} steps`} to go
      </h2>
      <ol className="mt-2 flex flex-col gap-2" aria-label="Getting started">
        {list.map((step, index) => {
          const done = progress.done[step.key];
          return (
            <li key={step.key} data-step={step.key} data-done={done ? 'yes' : 'no'} className="flex flex-wrap items-start gap-x-3 gap-y-2 text-sm">
              <span
                aria-hidden="true"
                className={`mt-0.5 flex h-6 w-6 shrink-0 items-center justify-center rounded-full border text-xs font-semibold ${done ? 'border-tide-600 bg-tide-600 text-white' : 'border-tide-600 bg-paper-raised text-tide-700'}`}
              >
                {done ? '✓' : index + 1}
              </span>
              <div className="min-w-0 flex-1 basis-48">
                <p className={done ? 'text-ink-soft' : 'font-medium text-ink'}>
                  {step.title}
                  {done ? <span className="ml-2 text-xs font-semibold text-tide-700">Done</span> : null}
                </p>
                {!done ? <p className="text-xs text-ink-soft">{step.detail}</p> : null}
              </div>
              {!done && step.href ? (
                <Link
                  href={step.href}
                  className={`ml-9 inline-flex min-h-11 shrink-0 items-center rounded-[3px] border px-3 py-1.5 text-sm font-medium sm:ml-0 ${step.key === next ? 'border-tide-700 bg-tide-600 text-white hover:bg-tide-700' : 'border-rule-strong bg-paper-raised text-tide-700 hover:bg-paper-sunk'}`}
                >
                  {step.action}
                  <span className="sr-only"> (step {index + 1}: {step.title.toLowerCase()})</span>
                </Link>
              ) : null}
            </li>
          );
        })}
      </ol>
    </section>
  );
}
