import type { SubmissionInput } from "@/lib/submissions/schema";

/**
 * A fly-and-recharge submission that passes the schema under the demo's first family (V/V 0.02,
 * mV/A 0.02, offset 0.5 mV) on a 4S-capable board: started at 2000 steps (40 mV/A), the implied
 * scale is 2000 × 1200/1300 ≈ 1846.2 (and 2000 × 1100/1192 ≈ 1845.6).
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
    currentScale: 1846,
    currentOffset: null,
    notes: "Three packs, props off for setup.",
    voltageCheck: null,
    cycles: [
      { scaleUsed: 2000, reportedMah: 1200, chargedMah: 1300, ratedMah: 1500, cells: 4 },
      { scaleUsed: 2000, reportedMah: 1100, chargedMah: 1192, ratedMah: 1500, cells: 4 },
    ],
    bench: null,
    ...overrides,
  };
}
