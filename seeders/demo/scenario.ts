import { buildDemoCatalogue, type DemoBoardAlias, type DemoBoardModel, type DemoBoardRevision, type DemoTruth } from "./catalogue";
import { attachDemoEvidence } from "./evidence";
import { buildDemoGarage, type DemoGarage } from "./garage";
import { DEMO_FIRMWARE_FAMILIES, type DemoFirmwareFamily } from "./firmware-families";
import { buildDemoHistory, type DemoApproval, type DemoHistoryRow } from "./history";
import { DEMO_MANUFACTURERS, type DemoManufacturer } from "./manufacturers";
import { buildDemoPeople, type DemoUser } from "./people";
import { buildDemoSubmissions, type DemoSubmission } from "./submissions";
import { startOfUtcDay } from "./timeline";

// The whole invented demo scenario as plain rows, built without a database so that tests can check
// it and the seeder only has to insert it. Rows refer to each other by slug / revision key; the
// seeder swaps those for the ids the database hands out.

export type DemoScenario = {
  /** the "now" the scenario was laid out from (start of the UTC day) */
  anchor: Date;
  seed: number;
  manufacturers: DemoManufacturer[];
  firmwareFamilies: DemoFirmwareFamily[];
  boardModels: DemoBoardModel[];
  boardRevisions: DemoBoardRevision[];
  boardAliases: DemoBoardAlias[];
  users: DemoUser[];
  submissions: DemoSubmission[];
  /** one approval event per approved submission, oldest first */
  approvals: DemoApproval[];
  /** the published-value timeline those approvals made, oldest first */
  valueHistory: DemoHistoryRow[];
  /** the demo contributor's garage: quads, packs with charge logs, worksheets (one published) */
  garage: DemoGarage;
  /** the values a perfect calibration would give: for tests of the statistics, never inserted */
  truths: DemoTruth[];
};

const DEMO_SEED = 20261202;

export type BuildOptions = { now?: Date; seed?: number };

export function buildDemoScenario({ now = new Date(), seed = DEMO_SEED }: BuildOptions = {}): DemoScenario {
  const anchor = startOfUtcDay(now);
  const families = DEMO_FIRMWARE_FAMILIES.map((f) => ({ ...f }));
  // separate seeds per part, so that changing one list does not reshuffle the others
  const catalogue = buildDemoCatalogue(families, anchor, seed + 1);
  const users = buildDemoPeople(anchor, seed + 2);
  const submissions = buildDemoSubmissions({ catalogue, families, users, anchor, seed: seed + 3 });
  attachDemoEvidence({ submissions, families, boardModels: catalogue.boardModels, truths: catalogue.truths, seed: seed + 4 });
  const { approvals, history } = buildDemoHistory(submissions, users);
  return {
    anchor,
    seed,
    manufacturers: DEMO_MANUFACTURERS.map((m) => ({ ...m })),
    firmwareFamilies: families,
    boardModels: catalogue.boardModels,
    boardRevisions: catalogue.boardRevisions,
    boardAliases: catalogue.boardAliases,
    users,
    submissions,
    approvals,
    valueHistory: history,
    garage: buildDemoGarage(users, submissions, anchor),
    truths: catalogue.truths,
  };
}

/**
 * Named places in the scenario that tests, the README and a demo walkthrough can point at.
 * scenario.test.ts checks that each one holds.
 */
export const DEMO_LANDMARKS = {
  /** boards with 80+ submissions */
  popularBoards: [
    "brackenwell-f7-mini",
    "brackenwell-tinsel-25-aio",
    "fernhollow-wisp-16-aio",
    "fernhollow-bramble-f7",
    "kestrune-corrie-aio",
    "marlpit-ember-f4",
    "tarnwick-osprel-f7",
  ],
  /** v2 halved the shunt, from 0.6 mΩ to 0.3 mΩ: v1's current scale is wrong for v2 */
  hardwareChange: { boardSlug: "brackenwell-tinsel-25-aio", before: "v1", after: "v2" },
  /** revisions with exactly this many submissions */
  sparseRevisions: {
    none: [
      { boardSlug: "brackenwell-f7-mini", label: "v2" },
      { boardSlug: "copperlode-bus-200-pdb", label: "rev A" },
    ],
    one: [
      { boardSlug: "duskwren-hush-45-mini-4in1", label: "v1" },
      { boardSlug: "ivelmoor-tussock-30-4in1", label: "v1.1" },
    ],
    two: [
      { boardSlug: "kestrune-vantle-h7", label: "rev B" },
      { boardSlug: "ivelmoor-quern-pm", label: "v1" },
    ],
  },
  /** aliases unlike the board's own name, for search by alias */
  distinctiveAliases: [
    { alias: "Gloamie", boardSlug: "duskwren-gloam-f4" },
    { alias: "Sluicebox", boardSlug: "copperlode-sluice-60-4in1" },
    { alias: "BWF7M", boardSlug: "brackenwell-f7-mini" },
    { alias: "Skerry Eighty", boardSlug: "kestrune-skerry-80-4in1" },
  ],
  /** misspellings a visitor might type, and the board they mean (not stored: for fuzzy search tests) */
  misspellings: [
    { query: "Brakenwell F7 Mini", boardSlug: "brackenwell-f7-mini" },
    { query: "Fernholow Wisp", boardSlug: "fernhollow-wisp-16-aio" },
    { query: "Osprell F7", boardSlug: "tarnwick-osprel-f7" },
  ],
} as const;
