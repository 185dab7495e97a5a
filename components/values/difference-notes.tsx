/** Plain-words warnings that another revision's values do not carry over (lib/published/revision-differences.ts). */
export function DifferenceNotes({ notes }: { notes: string[] }) {
  if (notes.length === 0) return null;
  return (
    <aside aria-labelledby="revision-differences-title" className="rounded-md border-3 border-l-[10px] border-copper bg-surface px-4 py-3">
      <h3 id="revision-differences-title" className="font-display text-lg font-bold tracking-wide uppercase">
        Revisions are not interchangeable
      </h3>
      <ul className="mt-1 list-disc space-y-1 pl-5">
        {notes.map((note) => (
          <li key={note}>{note}</li>
        ))}
      </ul>
    </aside>
  );
}
