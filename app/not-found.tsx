import Link from "next/link";
import { BoardSearch } from "@/components/board-search";

export const metadata = { title: "Not found" };

export default function NotFound() {
  return (
    <div className="grid gap-10 lg:grid-cols-[auto_1fr] lg:items-center">
      <NeedleAtZero />
      <div className="space-y-6">
        <p className="font-mono text-lg font-bold text-copper">404</p>
        <h1 className="font-display text-title uppercase">Nothing on the bench here</h1>
        <p className="max-w-prose text-lead">
          There is no page at this address. The board may have been renamed or merged into another entry, or the link has a typo.
        </p>
        <div className="max-w-2xl rounded-md border-3 border-rule bg-surface p-4 sm:p-6">
          <BoardSearch id="notfound-search" />
        </div>
        <p>
          <Link href="/boards" className="font-semibold">
            Browse all boards
          </Link>{" "}
          or go to the{" "}
          <Link href="/" className="font-semibold">
            front page
          </Link>
          .
        </p>
      </div>
    </div>
  );
}

/** A meter face with its needle resting on zero: nothing measured here. */
function NeedleAtZero() {
  return (
    <svg viewBox="0 0 200 120" className="w-56 max-w-full text-ink sm:w-72" aria-hidden="true" focusable="false">
      <path d="M20 105 A80 80 0 0 1 180 105" fill="none" stroke="currentColor" strokeWidth="6" strokeLinecap="round" />
      {Array.from({ length: 11 }, (_, i) => {
        const a = Math.PI - (i * Math.PI) / 10;
        const r1 = i % 5 === 0 ? 58 : 66;
        return (
          <line
            key={i}
            x1={100 + Math.cos(a) * r1}
            y1={105 - Math.sin(a) * r1}
            x2={100 + Math.cos(a) * 76}
            y2={105 - Math.sin(a) * 76}
            stroke="currentColor"
            strokeWidth={i % 5 === 0 ? 5 : 3}
            strokeLinecap="round"
          />
        );
      })}
      <line x1="100" y1="105" x2="34" y2="100" stroke="var(--sb-copper)" strokeWidth="7" strokeLinecap="round" />
      <circle cx="100" cy="105" r="10" fill="currentColor" />
    </svg>
  );
}
