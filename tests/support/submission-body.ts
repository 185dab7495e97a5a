import type { SubmissionInput } from "@/lib/submissions/schema";

/**
 * A fly-and-recharge submission that passes the schema under the integration tests' fixture family
 * (tests/support/fixtures.ts) on a 4S-capable board; the implied scale is 400 × 1200/1300 ≈ 369.2.
 * Unit tests under a demo family override the cycles and the scale with that family's figures.
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
