"use client";

import { useWatch } from "react-hook-form";
import { EVIDENCE_TOLERANCE, summariseEvidence, type EvidenceCheck, type EvidenceSummary } from "@/lib/calibration/evidence";
import { formatFigure } from "@/lib/catalogue/format";
import { sectionsFor, type FamilyOption, type SubmissionDraft } from "./draft";
import { TitledPanel } from "@/components/titled-section";

// "What your evidence implies", recomputed as the form is filled in, with the same functions the
// server uses to flag a mismatch (lib/calibration/evidence.ts). Rows not yet complete are left out.

const positive = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v) && v > 0;
const finite = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);

function completeEvidence(d: SubmissionDraft) {
  const shown = sectionsFor(d.method, d.includeVoltageCheck);
  const readings = shown.voltageCheck
    ? d.voltageCheck.readings
        .filter((r) => positive(r.reportedVolts) && positive(r.measuredVolts))
        .map((r) => ({ ...r, cells: r.cells ?? 0, reportedVolts: r.reportedVolts!, measuredVolts: r.measuredVolts! }))
    : [];
  const cycles = shown.cycles
    ? d.cycles
        .filter((c) => positive(c.scaleUsed) && positive(c.reportedMah) && positive(c.chargedMah))
        .map((c) => ({ scaleUsed: c.scaleUsed!, reportedMah: c.reportedMah!, chargedMah: c.chargedMah!, ratedMah: c.ratedMah ?? 0, cells: c.cells ?? 0 }))
    : [];
  const points = shown.bench
    ? d.bench.points
        .filter((p) => finite(p.reportedAmps) && finite(p.measuredAmps))
        .map((p) => ({ reportedAmps: p.reportedAmps!, measuredAmps: p.measuredAmps! }))
    : [];
  const distinctCurrents = new Set(points.map((p) => p.measuredAmps)).size;
  return {
    voltageScale: finite(d.voltageScale) ? d.voltageScale : null,
    currentScale: finite(d.currentScale) ? d.currentScale : null,
    currentOffset: finite(d.currentOffset) ? d.currentOffset : null,
    voltageCheck: positive(d.voltageCheck.scaleUsed) && readings.length ? { scaleUsed: d.voltageCheck.scaleUsed, readings } : null,
    cycles,
    bench:
      positive(d.bench.scaleUsed) && finite(d.bench.offsetUsed) && distinctCurrents >= 2
        ? { scaleUsed: d.bench.scaleUsed, offsetUsed: d.bench.offsetUsed, points }
        : null,
  };
}

function summarise(d: SubmissionDraft, family: FamilyOption): EvidenceSummary | null {
  try {
    const s = summariseEvidence(completeEvidence(d), family);
    return s.voltage || s.cycles || s.bench ? s : null;
  } catch {
    return null; // a half-typed figure; the fields' own messages say what is wrong
  }
}

const LABELS = { voltage_scale: "voltage scale", current_scale: "current scale", current_offset: "current offset" } as const;

function Verdict({ c }: { c: EvidenceCheck }) {
  const rel = c.relativeDifference === null ? null : Math.abs(c.relativeDifference) * 100;
  const apart = rel === null ? "" : rel < 0.05 ? ", the same as it" : `, ${formatFigure(rel, 1)} % ${c.difference >= 0 ? "above" : "below"} it`;
  return (
    <li className={c.mismatch ? "font-semibold text-fault" : ""}>
      You entered a {LABELS[c.quantity]} of <span className="font-mono">{c.claimed}</span>
      {apart}:{" "}
      {c.mismatch
        ? "further off than we expect. It can still be sent; a moderator will look closely, so check the figures or say why in the notes."
        : "within what we expect."}
    </li>
  );
}

export function EvidencePreview({ family }: { family: FamilyOption | null }) {
  const draft = useWatch<SubmissionDraft>() as SubmissionDraft;
  if (!family || !draft?.method) return null;
  const s = summarise(draft, family);
  if (!s) return null;
  const lines: string[] = [];
  if (s.voltage) lines.push(`Your voltage readings imply a voltage scale of ${formatFigure(s.voltage.implied, 1)}.`);
  if (s.cycles)
    lines.push(
      `Your cycles imply a current scale of ${formatFigure(s.cycles.implied, 1)} ${s.cycles.perCycle.length > 1 ? ` (the median of ${s.cycles.perCycle.length} cycles)` : ""}.`,
    );
  if (s.bench) {
    lines.push(
      `Your bench points imply a current scale of ${formatFigure(s.bench.impliedScale, 1)} and an offset of ${formatFigure(s.bench.impliedOffset, 1)}` +
        (s.bench.r !== null ? ` (the line fits with r = ${formatFigure(s.bench.r, 3)}).` : "."),
    );
  }
  return (
    <TitledPanel id="implied" title="What your evidence implies" live className="rounded-md border-3 border-verdigris bg-surface p-4">
      <ul className="mt-2 space-y-1">
        {lines.map((l) => (
          <li key={l}>{l}</li>
        ))}
        {s.checks.map((c) => (
          <Verdict key={`${c.quantity}-${c.source}`} c={c} />
        ))}
      </ul>
      <p className="mt-2 text-small text-muted">
        We flag a value more than {EVIDENCE_TOLERANCE * 100} % from what its evidence implies (for offsets, also more than{" "}
        {formatFigure(s.offsetToleranceFloorSteps, 0)} steps: 10, or what moves the display 0.1 A if that is more) for a closer look.
      </p>
    </TitledPanel>
  );
}
