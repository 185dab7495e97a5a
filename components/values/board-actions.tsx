import Link from "next/link";

// Every board page ends its values with the two ways to add to them, and where to read how they are made.
export function BoardActions({ slug }: { slug: string }) {
  return (
    <div className="space-y-2">
      <p className="flex flex-wrap gap-3" data-testid="board-actions">
        <Link href={`/garage?board=${encodeURIComponent(slug)}`} className="sb-button sb-button-quiet">
          Calibrate this board
        </Link>
        <Link href={`/submit?board=${encodeURIComponent(slug)}`} className="sb-button sb-button-quiet">
          Send your values
        </Link>
      </p>
      <p className="text-small">
        <Link href="/how-the-numbers-are-made">How these numbers are made</Link>
      </p>
    </div>
  );
}
