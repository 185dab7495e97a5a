"use client";

import { tableFeatures, useTable, type ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { useMemo } from "react";
import { When } from "@/components/when";
import { formatFigure, plural } from "@/lib/catalogue/format";
import type { EvidenceCounts, QueueRow } from "@/lib/moderation/queue";
import type { QuantityKey } from "@/lib/published/board-values-types";
import { spreadMultiple } from "@/lib/stats";
import { METHOD_LABELS } from "@/lib/vocabulary";

// The pending submissions as a TanStack table. Paging, sorting and filtering happen on the server
// (the URL holds them), so the table only lays out the rows it is given. Each row says how the
// values were found (unverified ones marked), what evidence came with them, and each value beside
// its group's published median, so a moderator sees at a glance what a flag is about.

const features = tableFeatures({});
const figure = (v: number) => formatFigure(v, 4);

const QUANTITY_NAMES: Record<QuantityKey, string> = { voltageScale: "Voltage scale", currentScale: "Current scale", currentOffset: "Current offset" };
const QUANTITY_KEYS: QuantityKey[] = ["voltageScale", "currentScale", "currentOffset"];

/** "far off" in a moderator's plain words; an unbounded score means the approved values all agree exactly. */
function farOffLabel(maxAbsZ: number | null): string {
  return maxAbsZ === null ? "Far off: the approved values all agree and this differs" : `Far off: ${spreadMultiple(maxAbsZ)}× the usual spread`;
}

function FlagChips({ flags }: { flags: Pick<QueueRow["flags"], "outlier" | "mismatch" | "newContributor" | "maxAbsZ"> }) {
  const chips: { label: string; tone: string }[] = [];
  if (flags.outlier) chips.push({ label: farOffLabel(flags.maxAbsZ), tone: "border-fault text-fault" });
  if (flags.mismatch) chips.push({ label: "Evidence disagrees", tone: "border-caution-edge bg-caution text-ink" });
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

/** "4 readings · 2 photos", or that nothing came with it. */
function evidenceWords(e: EvidenceCounts): string {
  const parts = [
    e.readings ? plural(e.readings, "voltage reading") : "",
    e.cycles ? plural(e.cycles, "charge cycle") : "",
    e.benchPoints ? plural(e.benchPoints, "bench point") : "",
    e.photos ? plural(e.photos, "photo") : "",
  ].filter(Boolean);
  return parts.length ? parts.join(" · ") : "No evidence, no photos";
}

function Method({ row }: { row: QueueRow }) {
  const none = !row.evidence.readings && !row.evidence.cycles && !row.evidence.benchPoints && !row.evidence.photos;
  return (
    <div className="text-small">
      {row.method === "unverified" ? (
        <p className="inline-block rounded-sm border-2 border-dashed border-caution-edge px-1.5 font-semibold" data-testid="unverified-mark">
          Unverified: not measured
        </p>
      ) : (
        <p className="font-semibold">{METHOD_LABELS[row.method]}</p>
      )}
      <p className={none ? "text-muted" : ""}>{evidenceWords(row.evidence)}</p>
    </div>
  );
}

function Values({ row }: { row: QueueRow }) {
  const present = QUANTITY_KEYS.filter((k) => row.values[k] !== null);
  return (
    <ul className="space-y-0.5 text-small">
      {present.map((k) => {
        const g = row.group[k];
        return (
          <li key={k}>
            {QUANTITY_NAMES[k]} <span className="font-mono font-semibold">{figure(row.values[k]!)}</span>
            <span className="text-muted">
              {" · "}
              {g ? (
                <>
                  median <span className="font-mono">{figure(g.median)}</span> of {plural(g.n, "value")}
                </>
              ) : (
                "nothing approved yet"
              )}
            </span>
          </li>
        );
      })}
    </ul>
  );
}

/** The columns; each review link keeps the queue's filters (`filters`, a query string or ""), so the review's "next" follows them. */
const columnsFor = (filters: string): ColumnDef<typeof features, QueueRow>[] => [
  {
    id: "submission",
    header: "Submission",
    cell: ({ row }) => (
      <div>
        <Link href={`/moderation/${row.original.id}${filters}`} className="font-semibold" aria-label={`Review submission #${row.original.id}`}>
          #{row.original.id} {row.original.board.name}
        </Link>
        <p className="text-small text-muted">
          revision {row.original.revision.label} · {row.original.family.name} · by {row.original.contributor.name}
        </p>
        <p className="text-small text-muted">
          Sent <When at={row.original.createdAt} time />
        </p>
      </div>
    ),
  },
  { id: "method", header: "How measured", cell: ({ row }) => <Method row={row.original} /> },
  { id: "values", header: "Values and the group's median", cell: ({ row }) => <Values row={row.original} /> },
  { id: "flags", header: "Flags", cell: ({ row }) => <FlagChips flags={row.original.flags} /> },
];

export function QueueTable({
  rows,
  selectable,
  selected,
  onToggle,
  blockedWhy,
  filters,
}: {
  rows: QueueRow[];
  /** The queue's filters as "?flag=…&board=…" (or ""), carried into each review link. */
  filters: string;
  selectable: (r: QueueRow) => boolean;
  selected: ReadonlySet<number>;
  onToggle: (id: number) => void;
  /** Why a selectable row cannot join the current selection now (another kind is selected), or null. */
  blockedWhy: (r: QueueRow) => string | null;
}) {
  const columns = useMemo(() => columnsFor(filters), [filters]);
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
          {table.getRowModel().rows.map((row) => {
            const r = row.original;
            const canSelect = selectable(r);
            const blocked = canSelect ? blockedWhy(r) : null;
            return (
              <tr key={row.id} data-testid="queue-row" className="block border-t-2 border-rule-soft p-3 sm:table-row sm:p-0">
                {/* on a phone a flagged row has no checkbox, and an empty cell would leave a blank line above it */}
                <td className={`${canSelect ? "inline-block" : "hidden"} align-top sm:table-cell sm:px-3 sm:py-2`}>
                  {canSelect ? (
                    <>
                      <input
                        type="checkbox"
                        className="size-6"
                        aria-label={`Select #${r.id} for bulk approval`}
                        aria-describedby={blocked ? `blocked-${r.id}` : undefined}
                        checked={selected.has(r.id)}
                        disabled={blocked !== null}
                        onChange={() => onToggle(r.id)}
                      />
                      {blocked && (
                        <span id={`blocked-${r.id}`} className="sr-only">
                          {blocked}
                        </span>
                      )}
                    </>
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
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
