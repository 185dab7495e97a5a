import type { SubmissionInput } from "@/lib/submissions/schema";

/**
 * A fly-and-recharge submission that passes the schema under the demo's first family (V/V 0.1,
 * mV/A 0.1, offset mV) on a 4S-capable board; the implied scale is 400 × 1200/1300 ≈ 369.2.
 */
export function flyRechargeBody(
  target: Pick<SubmissionInput, "boardRevisionId" | "firmwareFamilyId">,
  overrides: Partial<SubmissionInput> = {},
): SubmissionInput {
  return {
    boardRevisionId: target.boardRevisionId,
    firmwareFamilyId: target.firmwareFamilyId,
    firmwareVersion: "dunlin",
    sensingSource: "board_adc",
    method: "fly_recharge",
    voltageScale: null,
    currentScale: 369,
    currentOffset: null,
    notes: "Three packs, props off for setup.",
    voltageCheck: null,
    cycles: [
      { scaleUsed: 400, reportedMah: 1200, chargedMah: 1300, ratedMah: 1500, cells: 4 },
      { scaleUsed: 400, reportedMah: 1100, chargedMah: 1192, ratedMah: 1500, cells: 4 },
    ],
    bench: null,
    ...overrides,
  };
}
