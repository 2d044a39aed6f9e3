'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';

export function LabNav({ items }: { items: { href: string; label: string }[] }) {
  const path = usePathname();
  return (
    <nav aria-label="Lab sections" className="flex flex-wrap gap-1">
      {items.map((item) => {
        const active = item.href === '/' ? path === '/' : path.startsWith(item.href);
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={active ? 'page' : undefined}
            className={`rounded-md px-3 py-1.5 text-sm ${active ? 'bg-accent-soft font-semibold text-accent' : 'text-ink-muted hover:text-ink'}`}
          >
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}
