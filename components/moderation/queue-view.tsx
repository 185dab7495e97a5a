"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import type { BulkState } from "@/app/moderation/actions";
import type { QueueRow } from "@/app/moderation/_data/queue";
import { QueueTable } from "./queue-table";

// Bulk approval is only offered for rows with no flag at all: anything far off, with disagreeing
// evidence or from a first-time contributor is reviewed one by one.
const unflagged = (r: QueueRow) => !r.outlier && !r.mismatch && !r.newContributor;

export function QueueView({ rows, approve }: { rows: QueueRow[]; approve: (items: { id: number; version: number }[]) => Promise<BulkState> }) {
  const router = useRouter();
  const [selected, setSelected] = useState<Set<number>>(new Set());
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const toggle = (id: number) =>
    setSelected((s) => {
      const next = new Set(s);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  const candidates = rows.filter(unflagged);

  async function approveSelected() {
    setBusy(true);
    setMessage(null);
    const items = rows.filter((r) => selected.has(r.id)).map((r) => ({ id: r.id, version: r.version }));
    const result = await approve(items).catch(() => ({ ok: false, message: "The approvals could not be sent. Try again in a moment." }));
    setBusy(false);
    setSelected(new Set());
    setMessage({ ok: result.ok, text: result.message });
    router.refresh();
  }

  return (
    <div className="space-y-3">
      {candidates.length > 0 && (
        <div className="flex flex-wrap items-center gap-3">
          <button type="button" className="sb-button sb-button-quiet min-h-11" onClick={() => setSelected(new Set(candidates.map((r) => r.id)))}>
            Select all unflagged ({candidates.length})
          </button>
          <button type="button" className="sb-button min-h-11" disabled={selected.size === 0 || busy} onClick={approveSelected}>
            {busy ? "Approving…" : `Approve selected (${selected.size})`}
          </button>
        </div>
      )}
      {message && (
        <p role={message.ok ? "status" : "alert"} className={message.ok ? "font-semibold" : "font-semibold text-fault"}>
          {message.text}
        </p>
      )}
      <QueueTable rows={rows} selectable={unflagged} selected={selected} onToggle={toggle} />
    </div>
  );
}
