import type { BoardKind } from "@/models/BoardModel";

// The invented board catalogue of the demo scenario: every maker, board and alias here is made up.
// Hardware that a maker "published" is filled in; null means unknown and stays NULL in the
// database (the scenario invents a hidden true value for it, see hardware.ts).
//
// Dividers are chosen to cover the board's maximum cell count at 4.35 V per cell (HV packs) with a
// 3.3 V ADC: ratio ≥ cells × 4.35 / 3.3 (derived from the divider formula Vout = Vin·R2/(R1+R2):
// the full pack must reach the pin below Vref).

export type DividerSpec = { topOhms: number; bottomOhms: number } | null;
export type SensorSpec =
  | { kind: "shunt"; milliohms: number | null; gain: number | null }
  | { kind: "hall"; mvPerAmp: number | null }
  | null;

export type RevisionSpec = {
  label: string;
  /** months before the scenario's "now" that this revision shipped */
  monthsAgo: number;
  divider: DividerSpec;
  sensor: SensorSpec;
  /** true: the maker states a 12-bit ADC at 3.3 V; false: not stated */
  adcKnown: boolean;
  notes?: string;
  /** a fixed number of submissions (the sparse cases); otherwise drawn from the board's tier */
  submissions?: number;
};

/** How many submissions a board gathers in total: hot 85–130, common 10–30, niche 3–9. */
export type PopularityTier = "hot" | "common" | "niche";

export type BoardSpec = {
  maker: string;
  name: string;
  kind: BoardKind;
  mounting: string;
  minCells: number;
  maxCells: number;
  tier: PopularityTier;
  aliases: string[];
  description?: string;
  revisions: RevisionSpec[];
};

const div = (topOhms: number, bottomOhms: number): DividerSpec => ({ topOhms, bottomOhms });
const D5 = div(10_000, 2_200); // ÷5.55, up to 4S HV
const D9 = div(10_000, 1_200); // ÷9.33, up to 7S HV
const D11 = div(10_000, 1_000); // ÷11, up to 8S HV
const D11B = div(100_000, 10_000); // ÷11 with lower standing drain
const D11C = div(47_000, 4_700); // ÷11
const D16 = div(15_000, 1_000); // ÷16, up to 12S HV
const shunt = (milliohms: number | null, gain: number | null): SensorSpec => ({ kind: "shunt", milliohms, gain });
const hall = (mvPerAmp: number | null): SensorSpec => ({ kind: "hall", mvPerAmp });

const rev = (label: string, monthsAgo: number, divider: DividerSpec, sensor: SensorSpec, extra: Partial<RevisionSpec> = {}): RevisionSpec => ({
  label,
  monthsAgo,
  divider,
  sensor,
  adcKnown: true,
  ...extra,
});

export const DEMO_BOARDS: readonly BoardSpec[] = [
  // ── Brackenwell Avionics ─────────────────────────────────────────────────────────────
  {
    maker: "brackenwell", name: "Brackenwell F7 Mini", kind: "flight_controller", mounting: "20x20", minCells: 3, maxCells: 8, tier: "hot",
    aliases: ["BW F7 Mini", "Bracken Mini", "BWF7M"],
    description: "Compact flight controller with an onboard battery divider; current comes from the stacked ESC.",
    revisions: [
      rev("v1", 34, D11, null),
      rev("v1.1", 20, D11B, null, { notes: "Same ratio as v1 with larger resistors, so the divider draws less from the pack." }),
      rev("v2", 2, D16, null, { submissions: 0, notes: "v2 moves to a ÷16 divider for 12S support: v1 voltage scales do not carry over." }),
    ],
  },
  {
    maker: "brackenwell", name: "Brackenwell F7 Wide", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "common",
    aliases: ["BW F7 Wide"],
    revisions: [rev("v1", 30, D11, null), rev("v1.1", 15, D11, null)],
  },
  {
    maker: "brackenwell", name: "Brackenwell Tinsel 25 AIO", kind: "aio", mounting: "25.5x25.5", minCells: 1, maxCells: 4, tier: "hot",
    aliases: ["Tinsel AIO", "BW Tinsel"],
    description: "Whoop-size all-in-one with flight controller and 4-in-1 ESC on one board.",
    revisions: [
      rev("v1", 28, D5, shunt(0.5, 50)),
      rev("v2", 12, D5, shunt(0.25, 50), { notes: "v2 halves the shunt to 0.25 mΩ for cooler running; current scales from v1 read half the real current." }),
    ],
  },
  {
    maker: "brackenwell", name: "Brackenwell Ravel 45 4in1", kind: "esc_4in1", mounting: "30.5x30.5", minCells: 3, maxCells: 6, tier: "common",
    aliases: ["Ravel 45"],
    revisions: [rev("v1", 26, null, shunt(0.5, 40), { adcKnown: false })],
  },
  {
    maker: "brackenwell", name: "Brackenwell Ravel 60 4in1", kind: "esc_4in1", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "common",
    aliases: ["Ravel 60", "Ravel Sixty"],
    revisions: [rev("v1", 22, null, shunt(0.25, 40), { adcKnown: false }), rev("rev B", 9, null, shunt(0.25, 50), { adcKnown: false })],
  },
  {
    maker: "brackenwell", name: "Brackenwell H7 Quarry", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "common",
    aliases: ["Quarry H7"],
    revisions: [rev("v1", 16, D11C, null)],
  },
  {
    maker: "brackenwell", name: "Brackenwell PM Lite", kind: "power_module", mounting: "20x20", minCells: 2, maxCells: 6, tier: "niche",
    aliases: [],
    revisions: [rev("v1", 24, D9, hall(40), { adcKnown: false })],
  },

  // ── Fernhollow Circuits ──────────────────────────────────────────────────────────────
  {
    maker: "fernhollow", name: "Fernhollow Wisp 16 AIO", kind: "aio", mounting: "16x16", minCells: 1, maxCells: 4, tier: "hot",
    aliases: ["Wisp16", "FH Wisp"],
    description: "Tiny all-in-one for 2–3 inch builds.",
    revisions: [rev("v1", 32, D5, shunt(1, 20)), rev("v1.1", 18, D5, shunt(1, 20)), rev("v2", 7, D5, shunt(0.5, 40))],
  },
  {
    maker: "fernhollow", name: "Fernhollow Wisp 20 AIO", kind: "aio", mounting: "20x20", minCells: 2, maxCells: 6, tier: "common",
    aliases: ["Wisp20"],
    revisions: [rev("v1", 21, D9, shunt(0.5, 50))],
  },
  {
    maker: "fernhollow", name: "Fernhollow Bramble F4", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 6, tier: "common",
    aliases: ["Bramble4"],
    revisions: [rev("v1", 35, D11, null), rev("v2", 17, D9, null)],
  },
  {
    maker: "fernhollow", name: "Fernhollow Bramble F7", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "hot",
    aliases: ["Bramble7", "FH Bramble F7"],
    revisions: [rev("v1", 29, D11, null), rev("v1.1", 13, D11, null)],
  },
  {
    maker: "fernhollow", name: "Fernhollow Bramble Mini F4", kind: "flight_controller", mounting: "20x20", minCells: 2, maxCells: 6, tier: "common",
    aliases: ["Bramble Mini"],
    revisions: [rev("v1", 19, null, null, { adcKnown: false })],
  },
  {
    maker: "fernhollow", name: "Fernhollow Thicket 50 4in1", kind: "esc_4in1", mounting: "30.5x30.5", minCells: 3, maxCells: 6, tier: "common",
    aliases: ["Thicket 50"],
    revisions: [rev("v1", 27, null, shunt(0.5, 20), { adcKnown: false }), rev("v1.1", 11, null, shunt(0.5, 20), { adcKnown: false })],
  },
  {
    maker: "fernhollow", name: "Fernhollow Thicket Nano 4in1", kind: "esc_4in1", mounting: "20x20", minCells: 2, maxCells: 4, tier: "niche",
    aliases: [],
    revisions: [rev("v1", 14, null, shunt(null, null), { adcKnown: false })],
  },
  {
    maker: "fernhollow", name: "Fernhollow Loam PDB", kind: "pdb", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "niche",
    aliases: ["Loam board"],
    revisions: [rev("v1", 33, null, hall(20), { adcKnown: false })],
  },

  // ── Kestrune Labs ────────────────────────────────────────────────────────────────────
  {
    maker: "kestrune", name: "Kestrune Vantle F4", kind: "flight_controller", mounting: "20x20", minCells: 2, maxCells: 6, tier: "common",
    aliases: ["Vantle4"],
    revisions: [rev("v1", 31, D9, null), rev("v1.1", 16, D9, null)],
  },
  {
    maker: "kestrune", name: "Kestrune Vantle F7", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "common",
    aliases: ["Vantle7", "KL Vantle"],
    revisions: [rev("v1", 25, D11, null)],
  },
  {
    maker: "kestrune", name: "Kestrune Vantle H7", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "niche",
    aliases: [],
    revisions: [rev("rev A", 12, D11, null), rev("rev B", 4, D11, null, { submissions: 2 })],
  },
  {
    maker: "kestrune", name: "Kestrune Corrie AIO", kind: "aio", mounting: "25.5x25.5", minCells: 1, maxCells: 4, tier: "hot",
    aliases: ["Corrie 25", "Kestrune Whoop AIO"],
    revisions: [rev("v1", 30, D5, shunt(0.5, 40)), rev("v2", 10, D5, shunt(0.5, 40))],
  },
  {
    maker: "kestrune", name: "Kestrune Corrie Slim AIO", kind: "aio", mounting: "20x20", minCells: 2, maxCells: 6, tier: "common",
    aliases: ["Corrie Slim"],
    revisions: [rev("v1", 18, D9, shunt(0.5, 50))],
  },
  {
    maker: "kestrune", name: "Kestrune Corrie 16 AIO", kind: "aio", mounting: "16x16", minCells: 1, maxCells: 4, tier: "common",
    aliases: [],
    revisions: [rev("v1", 15, D5, shunt(1, 25))],
  },
  {
    maker: "kestrune", name: "Kestrune Skerry 55 4in1", kind: "esc_4in1", mounting: "30.5x30.5", minCells: 3, maxCells: 6, tier: "common",
    aliases: ["Skerry 55"],
    revisions: [rev("v1", 28, null, shunt(0.25, 100), { adcKnown: false })],
  },
  {
    maker: "kestrune", name: "Kestrune Skerry 80 4in1", kind: "esc_4in1", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "common",
    aliases: ["Skerry Eighty"],
    revisions: [rev("v1", 20, null, shunt(0.25, 50), { adcKnown: false }), rev("v2", 6, null, hall(13.3), { adcKnown: false, notes: "v2 swaps the shunt for a Hall sensor." })],
  },
  {
    maker: "kestrune", name: "Kestrune Gully PM", kind: "power_module", mounting: "30.5x30.5", minCells: 2, maxCells: 8, tier: "common",
    aliases: ["Gully"],
    revisions: [rev("v1", 26, D11, hall(20), { adcKnown: false })],
  },

  // ── Marlpit Electric ─────────────────────────────────────────────────────────────────
  {
    maker: "marlpit", name: "Marlpit Ember F4", kind: "flight_controller", mounting: "30.5x30.5", minCells: 2, maxCells: 6, tier: "hot",
    aliases: ["Ember4", "Marlpit E4"],
    description: "Long-running budget flight controller.",
    revisions: [rev("v1", 36, D11, null), rev("v2", 22, D11, null), rev("v3", 8, D9, null)],
  },
  {
    maker: "marlpit", name: "Marlpit Ember F7", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 6, tier: "common",
    aliases: ["Ember7"],
    revisions: [rev("v1", 24, null, null, { adcKnown: false })],
  },
  {
    maker: "marlpit", name: "Marlpit Ember Nano F4", kind: "flight_controller", mounting: "16x16", minCells: 1, maxCells: 4, tier: "common",
    aliases: ["Ember Nano"],
    revisions: [rev("v1", 21, D5, null)],
  },
  {
    maker: "marlpit", name: "Marlpit Ember Whoop F4", kind: "flight_controller", mounting: "25.5x25.5", minCells: 1, maxCells: 4, tier: "niche",
    aliases: ["Ember Whoop"],
    revisions: [rev("v1", 23, D5, null), rev("v1.1", 10, D5, null)],
  },
  {
    maker: "marlpit", name: "Marlpit Ember H7", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "niche",
    aliases: [],
    revisions: [rev("v1", 7, D11, null)],
  },
  {
    maker: "marlpit", name: "Marlpit Cinder 35 4in1", kind: "esc_4in1", mounting: "20x20", minCells: 2, maxCells: 6, tier: "common",
    aliases: ["Cinder 35"],
    revisions: [rev("v1", 23, null, shunt(0.5, 50), { adcKnown: false })],
  },
  {
    maker: "marlpit", name: "Marlpit Cinder 65 4in1", kind: "esc_4in1", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "common",
    aliases: ["Cinder 65"],
    revisions: [rev("v1", 19, null, shunt(0.25, 60), { adcKnown: false })],
  },
  {
    maker: "marlpit", name: "Marlpit Hearth PDB", kind: "pdb", mounting: "30.5x30.5", minCells: 2, maxCells: 8, tier: "common",
    aliases: ["Hearth"],
    revisions: [rev("v1", 33, D11, shunt(0.5, 20), { adcKnown: false })],
  },
  {
    maker: "marlpit", name: "Marlpit Flint 12 AIO", kind: "aio", mounting: "25.5x25.5", minCells: 1, maxCells: 4, tier: "common",
    aliases: ["Flint AIO"],
    revisions: [rev("v1", 17, D5, shunt(1, 40))],
  },

  // ── Tarnwick Avionics ────────────────────────────────────────────────────────────────
  {
    maker: "tarnwick", name: "Tarnwick Osprel F7", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "hot",
    aliases: ["Osprel Seven", "TW Osprel"],
    revisions: [rev("v1", 27, D11C, null), rev("v1.1", 14, D11C, null)],
  },
  {
    maker: "tarnwick", name: "Tarnwick Osprel Mini F7", kind: "flight_controller", mounting: "20x20", minCells: 3, maxCells: 6, tier: "common",
    aliases: ["Osprel Mini"],
    revisions: [rev("v1", 20, D9, null)],
  },
  {
    maker: "tarnwick", name: "Tarnwick Osprel H7", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "common",
    aliases: [],
    revisions: [rev("v1", 11, D11, null)],
  },
  {
    maker: "tarnwick", name: "Tarnwick Pibble AIO", kind: "aio", mounting: "25.5x25.5", minCells: 1, maxCells: 4, tier: "common",
    aliases: ["Pibble"],
    revisions: [rev("v1", 25, D5, shunt(0.5, 60)), rev("v2", 9, D5, shunt(null, null), { notes: "The maker has not published the v2 shunt." })],
  },
  {
    maker: "tarnwick", name: "Tarnwick Gantry 40 4in1", kind: "esc_4in1", mounting: "20x20", minCells: 2, maxCells: 6, tier: "common",
    aliases: ["Gantry 40"],
    revisions: [rev("v1", 22, null, shunt(0.5, 40), { adcKnown: false })],
  },
  {
    maker: "tarnwick", name: "Tarnwick Gantry 70 4in1", kind: "esc_4in1", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "niche",
    aliases: [],
    revisions: [rev("v1", 10, null, shunt(0.25, 40), { adcKnown: false })],
  },
  {
    maker: "tarnwick", name: "Tarnwick Tollgate PM", kind: "power_module", mounting: "30.5x30.5", minCells: 2, maxCells: 8, tier: "common",
    aliases: ["Tollgate"],
    revisions: [rev("v1", 29, D11, shunt(0.5, 20), { adcKnown: false })],
  },

  // ── Duskwren Devices ─────────────────────────────────────────────────────────────────
  {
    maker: "duskwren", name: "Duskwren Gloam F4", kind: "flight_controller", mounting: "20x20", minCells: 2, maxCells: 6, tier: "common",
    aliases: ["Gloamie", "DW Gloam"],
    revisions: [rev("v1", 30, D9, null), rev("v2", 12, D9, null)],
  },
  {
    maker: "duskwren", name: "Duskwren Gloam F7", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "common",
    aliases: ["Gloam Seven"],
    revisions: [rev("v1", 18, D11, null)],
  },
  {
    maker: "duskwren", name: "Duskwren Murmur AIO", kind: "aio", mounting: "16x16", minCells: 1, maxCells: 4, tier: "common",
    aliases: ["Murmur"],
    revisions: [rev("v1", 24, D5, shunt(1, 50))],
  },
  {
    maker: "duskwren", name: "Duskwren Murmur Wide AIO", kind: "aio", mounting: "25.5x25.5", minCells: 2, maxCells: 6, tier: "niche",
    aliases: [],
    revisions: [rev("v1", 13, D9, shunt(0.5, 50))],
  },
  {
    maker: "duskwren", name: "Duskwren Hush 45 4in1", kind: "esc_4in1", mounting: "30.5x30.5", minCells: 3, maxCells: 6, tier: "common",
    aliases: ["Hush 45"],
    revisions: [rev("v1", 26, null, shunt(0.5, 40), { adcKnown: false })],
  },
  {
    maker: "duskwren", name: "Duskwren Hush 45 Mini 4in1", kind: "esc_4in1", mounting: "20x20", minCells: 2, maxCells: 6, tier: "niche",
    aliases: [],
    revisions: [rev("v1", 8, null, shunt(0.5, 40), { adcKnown: false, submissions: 1 })],
  },
  {
    maker: "duskwren", name: "Duskwren Lantern PDB", kind: "pdb", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "niche",
    aliases: ["Lantern"],
    revisions: [rev("v1", 31, null, hall(40), { adcKnown: false })],
  },

  // ── Copperlode Power ─────────────────────────────────────────────────────────────────
  {
    maker: "copperlode", name: "Copperlode Bus 120 PDB", kind: "pdb", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "common",
    aliases: ["Copper Bus", "CL Bus 120"],
    revisions: [rev("v1", 34, D11, shunt(0.25, 20), { adcKnown: false }), rev("v2", 14, D11, hall(20), { adcKnown: false })],
  },
  {
    maker: "copperlode", name: "Copperlode Bus 200 PDB", kind: "pdb", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "niche",
    aliases: [],
    revisions: [rev("rev A", 3, D11, hall(13.3), { adcKnown: false, submissions: 0 })],
  },
  {
    maker: "copperlode", name: "Copperlode Tap PM", kind: "power_module", mounting: "30.5x30.5", minCells: 2, maxCells: 8, tier: "common",
    aliases: ["Tap module"],
    revisions: [rev("v1", 32, D11, hall(40), { adcKnown: false }), rev("v1.1", 16, D11, hall(40), { adcKnown: false })],
  },
  {
    maker: "copperlode", name: "Copperlode Tap Mini PM", kind: "power_module", mounting: "20x20", minCells: 2, maxCells: 6, tier: "niche",
    aliases: [],
    revisions: [rev("v1", 12, D9, hall(66), { adcKnown: false })],
  },
  {
    maker: "copperlode", name: "Copperlode Sluice 60 4in1", kind: "esc_4in1", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "common",
    aliases: ["Sluicebox"],
    revisions: [rev("v1", 21, null, shunt(0.25, 80), { adcKnown: false })],
  },
  {
    maker: "copperlode", name: "Copperlode Assay F4", kind: "flight_controller", mounting: "30.5x30.5", minCells: 2, maxCells: 6, tier: "niche",
    aliases: [],
    revisions: [rev("v1", 28, D9, null)],
  },

  // ── Ivelmoor Hobby Works ─────────────────────────────────────────────────────────────
  {
    maker: "ivelmoor", name: "Ivelmoor Sprig AIO", kind: "aio", mounting: "16x16", minCells: 1, maxCells: 4, tier: "common",
    aliases: ["Sprig"],
    revisions: [rev("v1", 27, D5, shunt(1, 30)), rev("v1.1", 13, D5, shunt(1, 30))],
  },
  {
    maker: "ivelmoor", name: "Ivelmoor Sprig Plus AIO", kind: "aio", mounting: "20x20", minCells: 2, maxCells: 6, tier: "common",
    aliases: ["Sprig+"],
    revisions: [rev("v1", 15, D9, shunt(0.5, 60))],
  },
  {
    maker: "ivelmoor", name: "Ivelmoor Fennel F4", kind: "flight_controller", mounting: "20x20", minCells: 2, maxCells: 6, tier: "common",
    aliases: ["Fennel Four"],
    revisions: [rev("v1", 26, D9, null)],
  },
  {
    maker: "ivelmoor", name: "Ivelmoor Fennel F7", kind: "flight_controller", mounting: "30.5x30.5", minCells: 3, maxCells: 8, tier: "common",
    aliases: ["Fennel Seven"],
    revisions: [rev("v1", 19, D11B, null), rev("v2", 5, D11B, null)],
  },
  {
    maker: "ivelmoor", name: "Ivelmoor Tussock 30 4in1", kind: "esc_4in1", mounting: "16x16", minCells: 1, maxCells: 4, tier: "niche",
    aliases: [],
    revisions: [rev("v1", 20, null, shunt(1, 40), { adcKnown: false }), rev("v1.1", 9, null, shunt(1, 40), { adcKnown: false, submissions: 1 })],
  },
  {
    maker: "ivelmoor", name: "Ivelmoor Quern PDB", kind: "pdb", mounting: "30.5x30.5", minCells: 2, maxCells: 6, tier: "niche",
    aliases: ["Quern board"],
    revisions: [rev("v1", 30, null, shunt(0.5, 50), { adcKnown: false })],
  },
  {
    maker: "ivelmoor", name: "Ivelmoor Quern PM", kind: "power_module", mounting: "20x20", minCells: 2, maxCells: 6, tier: "niche",
    aliases: [],
    revisions: [rev("v1", 17, D9, shunt(0.5, 100), { adcKnown: false, submissions: 2 })],
  },
];
