import type { InferAttributes } from "sequelize";
import type { FirmwareFamily } from "@/models/FirmwareFamily";

// Three invented firmware families whose settings use different units, so that the catalogue shows
// why values are only comparable inside one family. Ranges are in setting steps (the integers the
// firmware stores), wide enough for 1–14S dividers and 2–200 mV/A sensors.
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
    description: "Stores the divider ratio in tenths and the sensor sensitivity in tenths of a millivolt per amp; current offset in millivolts.",
    voltageScaleUnit: "V/V",
    voltageScaleStep: 0.1,
    voltageScaleResponse: "proportional",
    voltageScaleMin: 10,
    voltageScaleMax: 2550,
    currentScaleUnit: "mV/A",
    currentScaleStep: 0.1,
    currentScaleResponse: "inverse",
    currentScaleMin: 1,
    currentScaleMax: 20000,
    currentOffsetUnit: "mV",
    currentOffsetStep: 1,
    currentOffsetMin: -3300,
    currentOffsetMax: 3300,
    versions: [
      { version: "4.2.1", monthsAgo: 30 },
      { version: "4.3.0", monthsAgo: 20 },
      { version: "4.4.2", monthsAgo: 11 },
      { version: "4.5.0", monthsAgo: 4 },
    ],
    defaults: { voltageScale: 110, currentScale: 400, currentOffset: 0 },
    share: 0.5,
  },
  {
    slug: "skelmar",
    name: "Skelmar",
    description: "Stores the divider ratio in hundredths and the current scale as amps per volt of sensor output, in hundredths; current offset in milliamps.",
    voltageScaleUnit: "V/V",
    voltageScaleStep: 0.01,
    voltageScaleResponse: "proportional",
    voltageScaleMin: 100,
    voltageScaleMax: 50000,
    currentScaleUnit: "A/V",
    currentScaleStep: 0.01,
    currentScaleResponse: "proportional",
    currentScaleMin: 10,
    currentScaleMax: 100000,
    currentOffsetUnit: "mA",
    currentOffsetStep: 1,
    currentOffsetMin: -10000,
    currentOffsetMax: 10000,
    versions: [
      { version: "7.0.3", monthsAgo: 28 },
      { version: "7.1.0", monthsAgo: 16 },
      { version: "8.0.1", monthsAgo: 6 },
    ],
    defaults: { voltageScale: 1100, currentScale: 2500, currentOffset: 0 },
    share: 0.3,
  },
  {
    slug: "quaysel",
    name: "Quaysel",
    description:
      "Stores the attenuation as tenths of a millivolt at the ADC pin per pack volt and the sensitivity in hundredths of a millivolt per amp; current offset in millivolts.",
    voltageScaleUnit: "mV/V",
    voltageScaleStep: 0.1,
    voltageScaleResponse: "inverse",
    voltageScaleMin: 10,
    voltageScaleMax: 10000,
    currentScaleUnit: "mV/A",
    currentScaleStep: 0.01,
    currentScaleResponse: "inverse",
    currentScaleMin: 10,
    currentScaleMax: 200000,
    currentOffsetUnit: "mV",
    currentOffsetStep: 1,
    currentOffsetMin: -3300,
    currentOffsetMax: 3300,
    versions: [
      { version: "2.9.4", monthsAgo: 26 },
      { version: "3.0.0", monthsAgo: 14 },
      { version: "3.1.2", monthsAgo: 5 },
    ],
    defaults: { voltageScale: 909, currentScale: 4000, currentOffset: 0 },
    share: 0.2,
  },
];
