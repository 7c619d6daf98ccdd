import { CAUTION_SENTENCE } from '@/lib/labels';

export function Panel({ title, actions, children, className = '' }: { title?: React.ReactNode; actions?: React.ReactNode; children: React.ReactNode; className?: string }) {
  return (
    <section className={`panel ${className}`}>
      {title || actions ? (
        <header className="panel-head">
          <h2 className="panel-title">{title}</h2>
          {actions}
        </header>
      ) : null}
      <div className="panel-body">{children}</div>
    </section>
  );
}

export function PageHeader({ title, subtitle, actions }: { title: React.ReactNode; subtitle?: React.ReactNode; actions?: React.ReactNode }) {
  return (
    <div className="mb-5 flex flex-wrap items-end justify-between gap-3 border-b border-rule pb-3">
      <div className="min-w-0 break-words">
        <h1 className="text-xl font-semibold text-ink sm:text-2xl">{title}</h1>
        {subtitle ? <p className="mt-0.5 text-sm text-ink-soft">{subtitle}</p> : null}
      </div>
      {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
    </div>
  );
}

// The status tag lives in its own file with the palette; re-exported here for the pages that import it with the panel.
export { StatusTag, type StatusTone } from '@/components/ui/status-tag';

/** A caution strip; without children it carries the one caution sentence (lib/labels/caution.ts). */
export function Caution({ children }: { children?: React.ReactNode }) {
  return (
    <aside role="note" className="rounded-[3px] border-l-4 border-brass-500 bg-brass-100 px-3 py-2 text-xs text-brass-700">
      <strong className="font-semibold">Caution. </strong>
      {children ?? CAUTION_SENTENCE}
    </aside>
  );
}
