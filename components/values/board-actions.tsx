import Link from "next/link";

// Every board page ends its values with the two ways to add to them.
export function BoardActions({ slug }: { slug: string }) {
  return (
    <p className="flex flex-wrap gap-3" data-testid="board-actions">
      <Link href={`/garage?board=${encodeURIComponent(slug)}`} className="sb-button sb-button-quiet">
        Calibrate this board
      </Link>
      <Link href={`/submit?board=${encodeURIComponent(slug)}`} className="sb-button sb-button-quiet">
        Send your values
      </Link>
    </p>
  );
}
