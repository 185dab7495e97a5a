import Link from "next/link";
import { ColumnHeads } from "@/components/column-heads";
import { formatCells, formatMounting } from "@/lib/catalogue/format";
import { kindLabel } from "@/lib/catalogue/kinds";
import type { CatalogueRow } from "@/lib/catalogue/list-boards";

const nf = new Intl.NumberFormat("en");

/**
 * The board list. Explicit ARIA roles keep it a table for screen readers even where the phone
 * layout (app/globals.css, .sb-catalogue) turns each row into a card.
 */
export function CatalogueTable({ rows, caption }: { rows: CatalogueRow[]; caption: string }) {
  return (
    <table className="sb-catalogue" role="table">
      <caption className="sr-only">{caption}</caption>
      <thead role="rowgroup">
        <tr role="row">
          <ColumnHeads
            role="columnheader"
            heads={[
              "Board",
              "Kind",
              "Mounting",
              "Cells",
              { label: "Revisions", className: "text-right" },
              { label: "Approved values", className: "text-right" },
            ]}
          />
        </tr>
      </thead>
      <tbody role="rowgroup">
        {rows.map((row) => (
          <tr key={row.id} role="row">
            <td role="cell">
              <Link href={`/boards/${row.slug}`} className="font-display text-2xl leading-tight font-bold">
                {row.name}
              </Link>
              <div className="text-small text-muted">{row.manufacturerName}</div>
            </td>
            <td role="cell" className="sb-kind">
              {kindLabel(row.kind)}
            </td>
            <td role="cell" data-label="Mounting" className="font-mono whitespace-nowrap">
              {formatMounting(row.mountingPattern)}
              <span className="text-muted"> mm</span>
            </td>
            <td role="cell" data-label="Cells" className="font-mono whitespace-nowrap">
              {formatCells(row.minCells, row.maxCells)}
            </td>
            <td role="cell" data-label="Revisions" className="sb-num">
              {nf.format(row.revisionCount)}
            </td>
            <td role="cell" data-label="Approved values" className="sb-num">
              <span className={row.approvedCount > 0 ? "font-bold text-verdigris" : "text-muted"}>{nf.format(row.approvedCount)}</span>
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
