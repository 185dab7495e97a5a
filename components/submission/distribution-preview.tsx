"use client";

import { useWatch } from "react-hook-form";
import { useBoardValues } from "@/components/hooks/use-board-values";
import { formatFigure, plural } from "@/lib/catalogue/format";
import type { QuantityKey, QuantityValues } from "@/lib/published/board-values-types";
import { placeValue } from "@/lib/submissions/placement";
import { spreadMultiple } from "@/lib/stats";
import { findGroup } from "@/components/values/selection";
import type { ChosenBoard, FamilyOption, SubmissionDraft } from "./draft";
import { TitledPanel } from "@/components/titled-section";

// Before sending: where the contributor's values fall among the approved ones for the same board
// revision and firmware family (GET /api/v1/boards/{slug}/values), as the median, its 95 % range
// and how far the value lies from the others in multiples of the usual spread (its modified
// z-score, lib/submissions/placement.ts, in plain words). The read is the board page's
// own (useBoardValues), so both share react-query's cache for the same view.

const QUANTITIES: { key: QuantityKey; title: string }[] = [
  { key: "voltageScale", title: "Voltage scale" },
  { key: "currentScale", title: "Current scale" },
  { key: "currentOffset", title: "Current offset" },
];

function Row({ title, value, q }: { title: string; value: number; q: QuantityValues | null }) {
  if (!q) {
    return (
      <li>
        <strong>
          {title} {value}:
        </strong>{" "}
        nobody has an approved value here yet, so yours would be the first.
      </li>
    );
  }
  const p = placeValue(
    value,
    q,
    (q.points ?? []).map((x) => x.value),
  );
  const range = q.ciLow !== null && q.ciHigh !== null ? `, 95 % range for the median ${formatFigure(q.ciLow)}–${formatFigure(q.ciHigh)}` : "";
  let where: string;
  if (p.rule === "too_few") where = "too few approved values to judge how far off it is.";
  else if (p.modifiedZ === null) where = "every approved value is the same and yours differs.";
  else
    where = p.outlier
      ? `far from the others (about ${spreadMultiple(p.modifiedZ)}× the usual spread), so a moderator will look twice.`
      : `in line with the others (about ${spreadMultiple(p.modifiedZ)}× the usual spread from the median).`;
  return (
    <li className={p.outlier ? "font-semibold" : ""}>
      <strong>
        {title} <span className="font-mono">{value}</span>:
      </strong>{" "}
      median <span className="font-mono">{formatFigure(q.median)}</span> of {plural(q.n, "approved value")}
      {range}; {where}
    </li>
  );
}

export function DistributionPreview({ board, families }: { board: ChosenBoard | null; families: readonly FamilyOption[] }) {
  const [revisionId, familyId, voltageScale, currentScale, currentOffset] = useWatch<SubmissionDraft>({
    name: ["boardRevisionId", "firmwareFamilyId", "voltageScale", "currentScale", "currentOffset"],
  }) as [number | null, number | null, number | null, number | null, number | null];
  const revision = board?.revisions.find((r) => r.id === revisionId) ?? null;
  const family = families.find((f) => f.id === familyId) ?? null;
  const ready = Boolean(board && revision && family);
  const selection = { revision: revision?.label ?? "", family: family?.slug ?? "" };
  const values = useBoardValues(board?.slug ?? "", selection, { enabled: ready });
  if (!ready) return null;
  const mine: Record<QuantityKey, number | null> = { voltageScale, currentScale, currentOffset };
  const entered = QUANTITIES.filter((q) => typeof mine[q.key] === "number" && Number.isFinite(mine[q.key]!));
  const group = values.data ? findGroup(values.data, revision!.label, family!.slug) : null;

  return (
    <TitledPanel id="placement" title="How your values compare" live className="rounded-md border-2 border-rule bg-surface p-4">
      <p className="mt-1 text-small text-muted">
        Approved values for the {board!.name} revision {revision!.label} under {family!.name}. A different value is not wrong: boards vary, and this is how
        outliers get found.
      </p>
      {values.isLoading && <p className="mt-2">Loading the published values…</p>}
      {values.error && <p className="mt-2 text-fault">{(values.error as Error).message}</p>}
      {values.isSuccess && entered.length === 0 && <p className="mt-2">Enter a value above to see where it falls.</p>}
      {values.isSuccess && entered.length > 0 && (
        <ul className="mt-2 space-y-1">
          {entered.map((q) => (
            <Row key={q.key} title={q.title} value={mine[q.key]!} q={group?.[q.key] ?? null} />
          ))}
        </ul>
      )}
    </TitledPanel>
  );
}
