'use client';
import Link from 'next/link';
import { usePathname } from 'next/navigation';

export interface NavItem {
  href: string;
  label: string;
}

export function OrgNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  return (
    <nav aria-label="Organisation" className="flex flex-col gap-0.5">
      {items.map((item) => {
        const active = pathname === item.href || (item.href.split('/').length > 3 && pathname.startsWith(item.href));
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={active ? 'page' : undefined}
            className={`nav-link ${active ? 'bg-tide-600 font-medium text-white' : 'text-tide-100 hover:bg-tide-700'}`}
          >
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}
