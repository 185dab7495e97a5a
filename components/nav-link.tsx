"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import type { ReactNode } from "react";

/** A header link that marks itself as the current section (aria-current) and shows it. */
export function NavLink({ href, children }: { href: string; children: ReactNode }) {
  const pathname = usePathname() ?? "/";
  const current = pathname === href || pathname.startsWith(`${href}/`);
  return (
    <Link
      href={href}
      aria-current={current ? "page" : undefined}
      className="inline-flex min-h-11 items-center border-b-4 border-transparent px-1 font-display text-lg font-bold uppercase tracking-wider text-ink no-underline hover:border-copper hover:text-ink aria-[current=page]:border-signal"
    >
      {children}
    </Link>
  );
}
