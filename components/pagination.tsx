import Link from "next/link";
import { pageWindow } from "@/lib/catalogue/page-window";

const cell = "inline-flex min-h-11 min-w-11 items-center justify-center rounded-md border-2 px-3 font-bold no-underline";

export function Pagination({ page, pageCount, hrefFor }: { page: number; pageCount: number; hrefFor: (page: number) => string }) {
  if (pageCount <= 1) return null;
  return (
    <nav aria-label="Pages" className="mt-6">
      <ul className="flex flex-wrap items-center gap-2">
        <li>
          {page > 1 ? (
            <Link href={hrefFor(page - 1)} rel="prev" className={`${cell} border-rule text-ink hover:bg-sunken hover:text-ink`}>
              ← Previous
            </Link>
          ) : (
            <span className={`${cell} border-rule-soft text-muted`} aria-disabled="true">
              ← Previous
            </span>
          )}
        </li>
        {pageWindow(page, pageCount).map((p, i) =>
          p === "gap" ? (
            <li key={`gap-${i}`} aria-hidden="true" className="px-1 font-mono text-muted">
              …
            </li>
          ) : (
            <li key={p}>
              <Link
                href={hrefFor(p)}
                aria-current={p === page ? "page" : undefined}
                aria-label={`Page ${p}`}
                className={`${cell} font-mono ${p === page ? "border-ink bg-ink text-paper hover:text-paper" : "border-rule text-ink hover:bg-sunken hover:text-ink"}`}
              >
                {p}
              </Link>
            </li>
          ),
        )}
        <li>
          {page < pageCount ? (
            <Link href={hrefFor(page + 1)} rel="next" className={`${cell} border-rule text-ink hover:bg-sunken hover:text-ink`}>
              Next →
            </Link>
          ) : (
            <span className={`${cell} border-rule-soft text-muted`} aria-disabled="true">
              Next →
            </span>
          )}
        </li>
      </ul>
    </nav>
  );
}
