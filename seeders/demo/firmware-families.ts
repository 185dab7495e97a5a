import type { InferAttributes } from "sequelize";
import type { FirmwareFamily } from "@/models/FirmwareFamily";

// Three invented firmware families whose settings use different units, so that the catalogue shows
// why values are only comparable inside one family. Every step, default and release name here is our
// own invention, chosen to be physically sensible and to copy no existing firmware's conventions.
//
// Ranges are in setting steps (the integers the firmware stores). Each one covers divider ratios
// from 1 (no divider) to 50, well past the 18.5 that a 14S HV pack needs at a 3.3 V ADC
// (14 × 4.35 V / 3.3 V, see hardware.ts minimumRatioFor), and sensors from 1 to 250 mV/A, around
// the 2–200 mV/A of hobby shunts and Hall sensors (common practice, no source). Offsets cover the
// whole ±3.3 V span of the ADC, or ±10 A of reading.
export type DemoFirmwareFamily = Omit<InferAttributes<FirmwareFamily>, "id" | "createdAt" | "updatedAt"> & {
  /** releases seen in the demo, oldest first, with how many months before "now" each came out */
  versions: ReadonlyArray<{ version: string; monthsAgo: number }>;
  /** what the firmware ships with; careless submitters sometimes send it unchanged */
  defaults: { voltageScale: number; currentScale: number; currentOffset: number };
  /** share of all demo submissions made under this family */
  share: number;
};

export const DEMO_FIRMWARE_FAMILIES: readonly DemoFirmwareFamily[] = [
  {
    slug: "vornel",
    name: "Vornel",
    description: "Stores the divider ratio in fiftieths and the sensor sensitivity in fiftieths of a millivolt per amp; current offset in half millivolts.",
    voltageScaleUnit: "V/V",
    voltageScaleStep: 0.02,
    voltageScaleResponse: "proportional",
    voltageScaleMin: 50, // ratio 1 / 0.02
    voltageScaleMax: 2500, // ratio 50 / 0.02
    currentScaleUnit: "mV/A",
    currentScaleStep: 0.02,
    currentScaleResponse: "inverse",
    currentScaleMin: 50, // 1 mV/A / 0.02
    currentScaleMax: 12500, // 250 mV/A / 0.02
    currentOffsetUnit: "mV",
    currentOffsetStep: 0.5,
    currentOffsetMin: -6600, // −3300 mV / 0.5
    currentOffsetMax: 6600,
    // releases are named after wading birds, in alphabetical order
    versions: [
      { version: "avocet", monthsAgo: 30 },
      { version: "bittern", monthsAgo: 20 },
      { version: "curlew", monthsAgo: 11 },
      { version: "dunlin", monthsAgo: 4 },
    ],
    // ratio 12.26, 37.86 mV/A, −1.5 mV
    defaults: { voltageScale: 613, currentScale: 1893, currentOffset: -3 },
    share: 0.5,
  },
  {
    slug: "skelmar",
    name: "Skelmar",
    description:
      "Stores the divider ratio in fortieths and the current scale as amps per volt of sensor output, in two-hundredths; current offset in tens of milliamps.",
    voltageScaleUnit: "V/V",
    voltageScaleStep: 0.025,
    voltageScaleResponse: "proportional",
    voltageScaleMin: 40, // ratio 1 / 0.025
    voltageScaleMax: 2000, // ratio 50 / 0.025
    currentScaleUnit: "A/V",
    currentScaleStep: 0.005,
    currentScaleResponse: "proportional",
    currentScaleMin: 800, // 250 mV/A = 4 A/V, / 0.005
    currentScaleMax: 200000, // 1 mV/A = 1000 A/V, / 0.005
    currentOffsetUnit: "mA",
    currentOffsetStep: 10,
    currentOffsetMin: -1000, // −10 A / 10 mA
    currentOffsetMax: 1000,
    // releases are named after minerals, in alphabetical order
    versions: [
      { version: "azurite", monthsAgo: 28 },
      { version: "barite", monthsAgo: 16 },
      { version: "calcite", monthsAgo: 6 },
    ],
    // ratio 14.275, 26.905 A/V (37.17 mV/A), +70 mA
    defaults: { voltageScale: 571, currentScale: 5381, currentOffset: 7 },
    share: 0.3,
  },
  {
    slug: "quaysel",
    name: "Quaysel",
    description:
      "Stores the attenuation as twentieths of a millivolt at the ADC pin per pack volt and the sensitivity in twenty-fifths of a millivolt per amp; current offset in quarter millivolts.",
    voltageScaleUnit: "mV/V",
    voltageScaleStep: 0.05,
    voltageScaleResponse: "inverse",
    voltageScaleMin: 400, // ratio 50 = 20 mV/V, / 0.05
    voltageScaleMax: 20000, // ratio 1 = 1000 mV/V, / 0.05
    currentScaleUnit: "mV/A",
    currentScaleStep: 0.04,
    currentScaleResponse: "inverse",
    currentScaleMin: 25, // 1 mV/A / 0.04
    currentScaleMax: 6250, // 250 mV/A / 0.04
    currentOffsetUnit: "mV",
    currentOffsetStep: 0.25,
    currentOffsetMin: -13200, // −3300 mV / 0.25
    currentOffsetMax: 13200,
    // releases are named after workshop tools, in alphabetical order
    versions: [
      { version: "anvil", monthsAgo: 26 },
      { version: "brace", monthsAgo: 14 },
      { version: "chisel", monthsAgo: 5 },
    ],
    // 75.85 mV/V (ratio 13.18), 34.12 mV/A, +2.75 mV
    defaults: { voltageScale: 1517, currentScale: 853, currentOffset: 11 },
    share: 0.2,
  },
];
