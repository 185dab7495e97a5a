import type { Transaction } from "sequelize";
import { summariseEvidence, type EvidenceSummary } from "@/lib/calibration/evidence";
import { SubmissionBenchPoint, SubmissionCycle, SubmissionVoltageReading, type BoardRevision, type FirmwareFamily } from "@/models";
import type { SubmissionPayload } from "./schema";

// A submission's evidence between its three forms: the payload sections (what the form and the
// API speak), the rows of the evidence tables, and the summary stored on the submission.

type Evidence = Pick<SubmissionPayload, "voltageCheck" | "cycles" | "bench">;

/** The implied values and the mismatch verdict; null when the submission carries no evidence. */
export function evidenceVerdict(payload: SubmissionPayload, family: FirmwareFamily): { summary: EvidenceSummary | null; mismatch: boolean } {
  if (!payload.voltageCheck && payload.cycles.length === 0 && !payload.bench) return { summary: null, mismatch: false };
  const summary = summariseEvidence(payload, family);
  return { summary, mismatch: summary.mismatch };
}

/**
 * What a validated contribution sets on its submissions row, with the evidence verdict worked out:
 * the same columns whether it is created or edited (status and contributor are the caller's).
 */
export function submissionColumns(payload: SubmissionPayload, family: FirmwareFamily, revision: Pick<BoardRevision, "id">) {
  const { summary, mismatch } = evidenceVerdict(payload, family);
  return {
    boardRevisionId: revision.id,
    firmwareFamilyId: family.id,
    firmwareVersion: payload.firmwareVersion,
    sensingSource: payload.sensingSource,
    method: payload.method,
    voltageScale: payload.voltageScale,
    currentScale: payload.currentScale,
    currentOffset: payload.currentOffset,
    notes: payload.notes,
    evidenceMismatch: mismatch,
    evidenceSummary: summary,
  };
}

/** Replaces the submission's evidence rows with the payload's (inside the caller's transaction). */
export async function writeEvidence(submissionId: number, evidence: Evidence, transaction: Transaction): Promise<void> {
  const where = { submissionId };
  await Promise.all([
    SubmissionVoltageReading.destroy({ where, transaction }),
    SubmissionCycle.destroy({ where, transaction }),
    SubmissionBenchPoint.destroy({ where, transaction }),
  ]);
  const check = evidence.voltageCheck;
  if (check) {
    await SubmissionVoltageReading.bulkCreate(
      check.readings.map((r, position) => ({ submissionId, position, scaleUsed: check.scaleUsed, ...r })),
      { transaction },
    );
  }
  if (evidence.cycles.length) {
    await SubmissionCycle.bulkCreate(
      evidence.cycles.map((c, position) => ({ submissionId, position, ...c })),
      { transaction },
    );
  }
  const bench = evidence.bench;
  if (bench) {
    await SubmissionBenchPoint.bulkCreate(
      bench.points.map((p, position) => ({ submissionId, position, scaleUsed: bench.scaleUsed, offsetUsed: bench.offsetUsed, ...p })),
      { transaction },
    );
  }
}

const byPosition = <T extends { position: number }>(rows: readonly T[] | undefined) => [...(rows ?? [])].sort((a, b) => a.position - b.position);

/** The payload sections back from the rows (for the edit form and the API's view). */
export function evidenceFromRows(rows: {
  voltageReadings?: SubmissionVoltageReading[];
  cycles?: SubmissionCycle[];
  benchPoints?: SubmissionBenchPoint[];
}): Evidence {
  const readings = byPosition(rows.voltageReadings);
  const points = byPosition(rows.benchPoints);
  return {
    // the form enters one scale per section; the first row carries it for all (see the migration)
    voltageCheck: readings.length
      ? {
          scaleUsed: readings[0].scaleUsed,
          readings: readings.map((r) => ({ cells: r.cells, reportedVolts: r.reportedVolts, measuredVolts: r.measuredVolts, measuredAt: r.measuredAt })),
        }
      : null,
    cycles: byPosition(rows.cycles).map((c) => ({
      scaleUsed: c.scaleUsed,
      reportedMah: c.reportedMah,
      chargedMah: c.chargedMah,
      ratedMah: c.ratedMah,
      cells: c.cells,
    })),
    bench: points.length
      ? {
          scaleUsed: points[0].scaleUsed,
          offsetUsed: points[0].offsetUsed,
          points: points.map((p) => ({ reportedAmps: p.reportedAmps, measuredAmps: p.measuredAmps })),
        }
      : null,
  };
}
