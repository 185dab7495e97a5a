import Link from "next/link";

/** One choice of a row of filter links (a status, a flag): 44 px tall for a thumb, the current one inverted. */
export function FilterChip({ href, active, children }: { href: string; active: boolean; children: React.ReactNode }) {
  return (
    <Link
      href={href}
      aria-current={active ? "true" : undefined}
      className={`inline-flex min-h-11 items-center gap-2 rounded-md border-2 px-3 font-semibold no-underline ${active ? "border-ink bg-ink text-paper hover:text-paper" : "border-rule text-ink hover:bg-sunken hover:text-ink"}`}
    >
      {children}
    </Link>
  );
}

/** The count inside a chip, read out as "N <what>". */
export function ChipCount({ n, what }: { n: number; what: string }) {
  return (
    <span className="rounded-sm bg-sunken px-1.5 font-mono text-small text-ink" aria-label={`${n} ${what}`}>
      {n}
    </span>
  );
}
