import Link from "next/link";
import type { ChosenBoard } from "@/lib/submissions/form-data";
import type { QuadCard as QuadCardData, StartingValue } from "@/lib/worksheets/quad-cards";
import { ConfirmDelete } from "./confirm-delete";
import { EditToggle } from "./edit-toggle";
import { QuadForm, type Choice } from "./garage-forms";

// One quad in the garage: a card whose title and "Open" lead to the quad's worksheets, with its
// board, firmware and the board's starting values, and Edit / Delete beneath.

function Starting({ label, value }: { label: string; value: StartingValue }) {
  return (
    <>
      <dt className="text-muted">{label}</dt>
      <dd>
        {value ? (
          <>
            <span className="font-mono">{value.setting}</span>{" "}
            <span className="text-small text-muted">{value.basis === "published" ? "published" : "from the parts list, not yet measured"}</span>
          </>
        ) : (
          <span className="sb-unknown">not known yet</span>
        )}
      </dd>
    </>
  );
}

export function QuadCard({
  quad,
  board,
  families,
  archives,
}: {
  quad: QuadCardData;
  board: ChosenBoard | null;
  families: Choice[];
  /** A published worksheet used it: Delete archives it instead. */
  archives: boolean;
}) {
  const href = `/garage/quads/${quad.id}`;
  const firmware = [quad.familyName, quad.firmwareVersion].filter(Boolean).join(" ");
  return (
    <article className="flex h-full flex-col gap-3 rounded-md border-3 border-rule bg-surface p-4" data-testid={`quad-${quad.id}`}>
      <header className="flex items-start justify-between gap-3">
        <h3 className="font-display text-lg font-bold uppercase">
          <Link href={href} className="text-ink no-underline hover:underline">
            {quad.name}
          </Link>
        </h3>
        <Link href={href} className="sb-button shrink-0" aria-label={`Open ${quad.name}`}>
          Open →
        </Link>
      </header>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-small">
        <dt className="text-muted">Board</dt>
        <dd>{quad.boardName ? `${quad.boardName} ${quad.revisionLabel}` : <span className="sb-unknown">not chosen</span>}</dd>
        <dt className="text-muted">Firmware</dt>
        <dd>{firmware || <span className="sb-unknown">not given</span>}</dd>
        <dt className="text-muted">ESC</dt>
        <dd>{quad.esc ?? <span className="sb-unknown">not given</span>}</dd>
        {quad.boardName && quad.familyName && (
          <>
            <Starting label="Voltage scale" value={quad.starting.voltageScale} />
            <Starting label="Current scale" value={quad.starting.currentScale} />
          </>
        )}
      </dl>
      {(!quad.boardName || !quad.familyName) && (
        <p className="text-small text-muted">Choose its board and firmware family to see the board&rsquo;s starting values.</p>
      )}
      {quad.notes && <p className="text-small whitespace-pre-line">{quad.notes}</p>}
      <div className="mt-auto flex flex-wrap gap-2">
        <EditToggle label="Edit" testId={`quad-${quad.id}-edit`}>
          <QuadForm families={families} quad={quad} board={board} />
        </EditToggle>
        <ConfirmDelete
          endpoint={`/api/v1/garage/quads/${quad.id}`}
          name={`the quad “${quad.name}”`}
          archives={archives}
          consequence={
            archives
              ? "One of its worksheets was published, so it is archived instead: hidden from your garage, its worksheets and your published values kept."
              : "Its worksheets go with it. This cannot be undone."
          }
          testId={`quad-${quad.id}-delete`}
        />
      </div>
    </article>
  );
}
