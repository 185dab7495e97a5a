import { TitledPanel } from "@/components/titled-section";

/** Plain-words warnings that another revision's values do not carry over (lib/published/revision-differences.ts). */
export function DifferenceNotes({ notes }: { notes: string[] }) {
  if (notes.length === 0) return null;
  return (
    <TitledPanel
      id="revision-differences"
      title="Revisions are not interchangeable"
      as="aside"
      className="rounded-md border-3 border-l-[10px] border-copper bg-surface px-4 py-3"
    >
      <ul className="mt-1 list-disc space-y-1 pl-5">
        {notes.map((note) => (
          <li key={note}>{note}</li>
        ))}
      </ul>
    </TitledPanel>
  );
}
