import { SOURCES } from "./sources";

// The usual cautions for the work a worksheet asks for, each naming its source (sources.ts). A
// page shows them beside the worksheet; they never replace the maker's instructions or local rules.

export type Caution = { text: string; source: string };

const DEFER: Caution = {
  text: "The maker's instructions for your board, ESC, charger and packs, and your local rules, come first.",
  source: SOURCES.commonPractice,
};

/** Bench current points are taken with props on and the motors under load. */
export const BENCH_CAUTIONS: readonly Caution[] = [
  { text: "Remove the props for setup; fit them only for the current points themselves.", source: "model-flying club safety rules" },
  { text: "Restrain the model, point it away from people, stay clear of the prop disc and wear eye protection.", source: "model-flying club safety rules" },
  { text: "Unplug the battery to make it safe; do not trust an arming switch.", source: "model-flying club safety rules" },
  { text: "Use an inline fuse (a smoke stopper) for the first power-up.", source: SOURCES.commonPractice },
  DEFER,
];

/** Fly-and-recharge cycles and charge logs mean charging packs again and again. */
export const CHARGING_CAUTIONS: readonly Caution[] = [
  { text: "Never leave a pack charging unattended.", source: `${SOURCES.bmfa}; ${SOURCES.uwEhs}` },
  {
    text: "Charge on a non-flammable surface or in a fire-retardant bag, at no more than 1C unless the maker allows more.",
    source: `${SOURCES.bmfa}; ${SOURCES.uwEhs}`,
  },
  { text: "Stop using a swollen pack.", source: `${SOURCES.bmfa}; ${SOURCES.uwEhs}` },
  { text: "Do not charge a standard LiPo cell above 4.20 V or discharge it below 3.0 V.", source: SOURCES.uwEhs },
  DEFER,
];
