'use client';
import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { useEffect, useRef, useState } from 'react';
import { OrgNav, type NavItem } from './org-nav';

interface OrgShellProps {
  organisationName: string;
  userName: string;
  roleLabel: string;
  items: NavItem[];
  /** The sign-out form (a server action, rendered by the layout). */
  signOut: React.ReactNode;
  /** Shown above the page, e.g. the read-only notice. */
  banner?: React.ReactNode;
  children: React.ReactNode;
}

const NAV_ID = 'org-navigation';

/**
 * The frame of every page inside an organisation. From 1024 px up the navigation is a sidebar, as it always was;
 * below that a top bar carries the product name, the organisation and a menu button that opens the same navigation
 * above the page. It closes on navigation and on Escape (focus goes back to the button).
 */
export function OrgShell({ organisationName, userName, roleLabel, items, signOut, banner, children }: OrgShellProps) {
  const pathname = usePathname();
  const [open, setOpen] = useState(false);
  const button = useRef<HTMLButtonElement>(null);
  const panel = useRef<HTMLElement>(null);
  const lastPath = useRef(pathname);
  const openRef = useRef(open);
  useEffect(() => {
    openRef.current = open;
  }, [open]);

  // A link followed from the open menu: close it and start reading at the new page's content.
  useEffect(() => {
    if (lastPath.current === pathname) return;
    lastPath.current = pathname;
    if (!openRef.current) return;
    setOpen(false);
    document.getElementById('content')?.focus({ preventScroll: true });
  }, [pathname]);

  useEffect(() => {
    if (!open) return;
    panel.current?.querySelector<HTMLElement>('nav a')?.focus();
    const onKey = (event: KeyboardEvent) => {
      if (event.key !== 'Escape') return;
      setOpen(false);
      button.current?.focus();
    };
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [open]);

  return (
    <div className="flex min-h-screen flex-col lg:flex-row">
      <header className="no-print sticky top-0 z-30 flex items-center gap-3 bg-tide-900 px-3 py-1.5 text-tide-100 lg:hidden">
        <Link href="/orgs" className="shrink-0 text-base font-semibold tracking-tight text-white">
          Tidewarden
        </Link>
        <span className="min-w-0 flex-1 truncate text-sm text-tide-100" title={organisationName}>
          {organisationName}
        </span>
        <button
          ref={button}
          type="button"
          aria-expanded={open}
          aria-controls={NAV_ID}
          onClick={() => setOpen((o) => !o)}
          className="inline-flex min-h-11 min-w-11 shrink-0 items-center justify-center gap-2 rounded-[3px] border border-tide-700 px-3 text-sm font-medium text-white hover:bg-tide-700"
        >
          <MenuIcon open={open} />
          Menu
        </button>
      </header>
      <aside
        ref={panel}
        id={NAV_ID}
        aria-label="Navigation"
        className={`no-print ${open ? 'flex' : 'hidden'} w-full flex-col gap-5 border-b border-tide-700 bg-tide-900 px-3 py-4 text-tide-100 max-lg:sticky max-lg:top-14 max-lg:z-20 max-lg:max-h-[calc(100dvh-3.5rem)] max-lg:overflow-y-auto max-lg:shadow-lg lg:flex lg:w-56 lg:shrink-0 lg:border-b-0`}
      >
        <Link href="/orgs" className="hidden px-2 text-lg font-semibold tracking-tight text-white lg:block">
          Tidewarden
        </Link>
        <div className="px-2">
          <p className="text-2xs uppercase tracking-[0.16em] text-tide-300">Organisation</p>
          <p className="break-words text-sm font-medium text-white">{organisationName}</p>
          <Link href="/orgs" className="inline-flex items-center text-2xs text-tide-300 hover:underline max-lg:min-h-11 max-lg:text-sm">
            Switch organisation
          </Link>
        </div>
        <OrgNav items={items} />
        <div className="mt-auto border-t border-tide-700 px-2 pt-3 text-xs">
          <p className="break-words text-white">{userName}</p>
          <p className="text-tide-300">{roleLabel}</p>
          {signOut}
        </div>
      </aside>
      <main id="content" tabIndex={-1} className="min-w-0 flex-1 px-3 py-4 outline-none sm:px-6 lg:px-8 lg:py-6">
        {banner}
        {children}
      </main>
    </div>
  );
}

function MenuIcon({ open }: { open: boolean }) {
  return (
    <svg aria-hidden width="18" height="18" viewBox="0 0 18 18" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round">
      {open ? <path d="M4 4l10 10M14 4L4 14" /> : <path d="M2 4.5h14M2 9h14M2 13.5h14" />}
    </svg>
  );
}
