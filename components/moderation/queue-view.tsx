"use client";

import { useState } from "react";
import { asApiFetchError } from "@/components/form-errors";
import { useBulkApprove } from "@/components/hooks/use-moderation";
import type { BulkResult } from "@/lib/moderation/actions";
import type { QueueRow } from "@/lib/moderation/queue";
import { QueueTable } from "./queue-table";

// Bulk approval is only offered for rows with no flag at all: anything far off, with disagreeing
// evidence or from a first-time contributor is reviewed one by one. Unverified values (nobody
// measured them) are approved in batches of their own, never together with measured ones: one
// "select all" button per kind, and the other kind's boxes wait until the selection is empty.
// (The server refuses flagged ones and mixed batches too, not only this page.)
const unflagged = (r: QueueRow) => !r.flags.outlier && !r.flags.mismatch && !r.flags.newContributor;
type Kind = "measured" | "unverified";
const kindOf = (r: QueueRow): Kind => (r.method === "unverified" ? "unverified" : "measured");
const SEPARATE = "Unverified and measured values are approved in separate batches: clear the selection first.";

/** What came of a bulk approval, in one sentence; ok only when every chosen item was approved. */
function bulkOutcome(r: BulkResult): { ok: boolean; text: string } {
  const parts = [`Approved ${r.approved.length}`];
  if (r.conflicted.length) parts.push(`someone else acted on ${r.conflicted.map((id) => `#${id}`).join(", ")} first`);
  if (r.refused.length)
    parts.push(
      `refused ${r.results
        .filter((x) => x.outcome === "refused")
        .map((x) => ("message" in x ? x.message : `#${x.id}`))
        .join(" ")}`,
    );
  return { ok: r.conflicted.length === 0 && r.refused.length === 0, text: `${parts.join("; ")}.` };
}

export function QueueView({ rows, filters }: { rows: QueueRow[]; filters: string }) {
  const bulkApprove = useBulkApprove();
  const [selected, setSelected] = useState<Set<number>>(new Set());
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const toggle = (id: number) =>
    setSelected((s) => {
      const next = new Set(s);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  const candidates = rows.filter(unflagged);
  const measured = candidates.filter((r) => kindOf(r) === "measured");
  const unverified = candidates.filter((r) => kindOf(r) === "unverified");
  const selectedKind = rows.find((r) => selected.has(r.id));
  const blockedWhy = (r: QueueRow) => (selectedKind && kindOf(selectedKind) !== kindOf(r) ? SEPARATE : null);

  async function approveSelected() {
    setMessage(null);
    const items = rows.filter((r) => selected.has(r.id)).map((r) => ({ id: r.id, version: r.version }));
    const outcome = await bulkApprove.mutateAsync({ items }).then(bulkOutcome, (error: unknown) => {
      const refused = asApiFetchError(error);
      // no answer at all keeps the queue's own words; a refusal of the whole request says the server's
      return { ok: false, text: refused.status === 0 ? "The approvals could not be sent. Try again in a moment." : refused.message };
    });
    setSelected(new Set());
    setMessage(outcome);
  }

  return (
    <div className="space-y-3">
      {candidates.length > 0 && (
        <div className="flex flex-wrap items-center gap-3">
          {measured.length > 0 && (
            <button type="button" className="sb-button sb-button-quiet min-h-11" onClick={() => setSelected(new Set(measured.map((r) => r.id)))}>
              Select all unflagged measured ({measured.length})
            </button>
          )}
          {unverified.length > 0 && (
            <button type="button" className="sb-button sb-button-quiet min-h-11" onClick={() => setSelected(new Set(unverified.map((r) => r.id)))}>
              Select all unflagged unverified ({unverified.length})
            </button>
          )}
          {selected.size > 0 && (
            <button type="button" className="sb-button sb-button-quiet min-h-11" onClick={() => setSelected(new Set())}>
              Clear selection
            </button>
          )}
          <button type="button" className="sb-button min-h-11" disabled={selected.size === 0 || bulkApprove.isPending} onClick={approveSelected}>
            {bulkApprove.isPending ? "Approving…" : `Approve selected (${selected.size})`}
          </button>
        </div>
      )}
      {message && (
        <p role={message.ok ? "status" : "alert"} className={message.ok ? "font-semibold" : "font-semibold text-fault"}>
          {message.text}
        </p>
      )}
      {candidates.length > 0 && <p className="text-small text-muted">{SEPARATE.split(":")[0]}.</p>}
      <QueueTable rows={rows} selectable={unflagged} selected={selected} onToggle={toggle} blockedWhy={blockedWhy} filters={filters} />
    </div>
  );
}
