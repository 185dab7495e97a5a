"use client";

import { tableFeatures, useTable, type ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { formatFigure } from "@/lib/catalogue/format";
import type { QueueRow } from "@/lib/moderation/queue";

// The pending submissions as a TanStack table. Paging, sorting and filtering happen on the server
// (the URL holds them), so the table only lays out the rows it is given.

const features = tableFeatures({});
const dateTime = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", hour: "2-digit", minute: "2-digit", timeZone: "UTC" });
const figure = (v: number | null) => (v === null ? "—" : formatFigure(v, 4));

function FlagChips({ flags }: { flags: Pick<QueueRow["flags"], "outlier" | "mismatch" | "newContributor" | "maxAbsZ"> }) {
  const chips: { label: string; tone: string }[] = [];
  if (flags.outlier)
    chips.push({
      label: `Far off (|z| ${flags.maxAbsZ === null || !Number.isFinite(flags.maxAbsZ) ? "∞" : formatFigure(flags.maxAbsZ, 1)})`,
      tone: "border-fault text-fault",
    });
  if (flags.mismatch) chips.push({ label: "Evidence disagrees", tone: "border-caution-edge bg-caution" });
  if (flags.newContributor) chips.push({ label: "First-time contributor", tone: "border-rule" });
  if (chips.length === 0) return <span className="text-small text-muted">No flags</span>;
  return (
    <ul className="flex flex-wrap gap-1">
      {chips.map((c) => (
        <li key={c.label} className={`rounded-sm border-2 px-1.5 text-small font-semibold ${c.tone}`}>
          {c.label}
        </li>
      ))}
    </ul>
  );
}

const columns: ColumnDef<typeof features, QueueRow>[] = [
  {
    id: "submission",
    header: "Submission",
    cell: ({ row }) => (
      <div>
        <Link href={`/moderation/${row.original.id}`} className="font-semibold" aria-label={`Review submission #${row.original.id}`}>
          #{row.original.id} {row.original.board.name} rev {row.original.revision.label}
        </Link>
        <p className="text-small text-muted">
          {row.original.family.name} · by {row.original.contributor.name}
        </p>
      </div>
    ),
  },
  { id: "flags", header: "Flags", cell: ({ row }) => <FlagChips flags={row.original.flags} /> },
  {
    id: "values",
    header: "Voltage / current scale / offset",
    cell: ({ row }) => (
      <span className="font-mono text-small">
        {figure(row.original.values.voltageScale)} / {figure(row.original.values.currentScale)} / {figure(row.original.values.currentOffset)}
      </span>
    ),
  },
  { id: "sent", header: "Sent", cell: ({ row }) => <span className="text-small">{dateTime.format(new Date(row.original.createdAt))} UTC</span> },
];

export function QueueTable({
  rows,
  selectable,
  selected,
  onToggle,
}: {
  rows: QueueRow[];
  selectable: (r: QueueRow) => boolean;
  selected: ReadonlySet<number>;
  onToggle: (id: number) => void;
}) {
  const table = useTable({ features, columns, data: rows, getRowId: (r) => String(r.id) });
  return (
    <div className="overflow-x-auto rounded-md border-3 border-rule bg-surface">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Pending submissions, most serious first</caption>
        <thead className="hidden bg-sunken sm:table-header-group">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              <th scope="col" className="w-10 px-3 py-2">
                <span className="sr-only">Select for bulk approval</span>
              </th>
              {group.headers.map((header) => (
                <th key={header.id} scope="col" className="px-3 py-2 text-small font-bold tracking-wide uppercase">
                  <table.FlexRender header={header} />
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} data-testid="queue-row" className="block border-t-2 border-rule-soft p-3 sm:table-row sm:p-0">
              {/* on a phone a flagged row has no checkbox, and an empty cell would leave a blank line above it */}
              <td className={`${selectable(row.original) ? "inline-block" : "hidden"} align-top sm:table-cell sm:px-3 sm:py-2`}>
                {selectable(row.original) ? (
                  <input
                    type="checkbox"
                    className="size-6"
                    aria-label={`Select #${row.original.id} for bulk approval`}
                    checked={selected.has(row.original.id)}
                    onChange={() => onToggle(row.original.id)}
                  />
                ) : (
                  <span className="sr-only">Flagged: review one by one</span>
                )}
              </td>
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className="block py-1 align-top sm:table-cell sm:px-3 sm:py-2">
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
