import type { Chemistry } from "@/lib/vocabulary";
import { SOURCES } from "./sources";

// Per-cell voltage limits by pack chemistry, each naming where it comes from (the battery-safety
// guidance in sources.ts). Li-ion figures are recalled, not looked up: cells differ, and their
// maker's datasheet decides.

export { CHEMISTRIES, type Chemistry } from "@/lib/vocabulary";

type CellFigure = { volts: number; source: string };
type CellRange = { low: number; high: number; source: string };

export type ChemistryLimits = {
  label: string;
  full: CellFigure;
  storage: CellFigure;
  /** Where pilots usually land, read under load. */
  landUnderLoad: CellRange;
  /** Never below this under load. */
  minimumUnderLoad: CellFigure | CellRange;
  /** Never below this at rest. */
  minimumOffLoad: CellFigure | null;
};

export const CHEMISTRY_LIMITS: Record<Chemistry, ChemistryLimits> = {
  lipo: {
    label: "LiPo",
    full: { volts: 4.2, source: SOURCES.uwEhs },
    storage: { volts: 3.8, source: `${SOURCES.commonPractice}; neutral sources say 40–60 % charge (UW EH&S, BMFA)` },
    landUnderLoad: { low: 3.3, high: 3.5, source: SOURCES.commonPractice },
    minimumUnderLoad: { volts: 2.5, source: SOURCES.bmfa },
    minimumOffLoad: { volts: 3.0, source: `${SOURCES.uwEhs}; ${SOURCES.bmfa}` },
  },
  lihv: {
    label: "LiHV",
    full: { volts: 4.35, source: SOURCES.vendorsOnly },
    storage: { volts: 3.85, source: `nominal 3.8–3.85 V a cell (${SOURCES.commonPractice}); storage near it from memory` },
    landUnderLoad: { low: 3.3, high: 3.5, source: `${SOURCES.commonPractice} (given for LiPo; the same for HV from memory)` },
    minimumUnderLoad: { volts: 2.5, source: `${SOURCES.bmfa} (given for LiPo)` },
    minimumOffLoad: { volts: 3.0, source: `${SOURCES.uwEhs} (given for LiPo)` },
  },
  liion: {
    label: "Li-ion",
    full: { volts: 4.2, source: SOURCES.fromMemory },
    storage: { volts: 3.7, source: SOURCES.fromMemory },
    landUnderLoad: { low: 3.0, high: 3.2, source: SOURCES.fromMemory },
    minimumUnderLoad: { low: 2.5, high: 3.0, source: SOURCES.fromMemory },
    minimumOffLoad: null,
  },
};
