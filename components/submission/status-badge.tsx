import { STATUS_LABELS, type SubmissionStatus } from "@/lib/vocabulary";

// A submission's status as a label that reads without colour (the word is the signal; the colour
// and the mark only repeat it).
const STYLES: Record<SubmissionStatus, { mark: string; className: string }> = {
  pending: { mark: "◔", className: "border-rule bg-sunken text-ink" },
  approved: { mark: "✓", className: "border-verdigris bg-surface text-verdigris" },
  rejected: { mark: "✕", className: "border-fault bg-fault-wash text-fault" },
  changes_requested: { mark: "✎", className: "border-caution-edge bg-caution text-ink" },
};

export function StatusBadge({ status }: { status: SubmissionStatus }) {
  const s = STYLES[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border-2 px-3 py-0.5 text-small font-bold whitespace-nowrap ${s.className}`}>
      <span aria-hidden="true">{s.mark}</span>
      {STATUS_LABELS[status]}
    </span>
  );
}
