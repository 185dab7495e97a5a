import type { BoardKind, CurrentSensorKind } from "@/lib/vocabulary";

/** What every view of a board says about it: its name, kind, mounting and cell range. */
export type BoardFacts = { slug: string; name: string; kind: BoardKind; mountingPattern: string; minCells: number; maxCells: number };

/** A board's facts copied field by field (never spread), so a column added to a query does not silently become part of a response. */
export function boardFacts(board: BoardFacts): BoardFacts {
  return {
    slug: board.slug,
    name: board.name,
    kind: board.kind,
    mountingPattern: board.mountingPattern,
    minCells: board.minCells,
    maxCells: board.maxCells,
  };
}

export type BoardRevisionDetail = {
  id: number;
  label: string;
  position: number;
  releasedOn: string | null;
  dividerTopOhms: number | null;
  dividerBottomOhms: number | null;
  /** Pack volts per ADC-pin volt, from the two resistors; null when either is unknown. */
  dividerRatio: number | null;
  currentSensor: CurrentSensorKind | null;
  shuntMilliohms: number | null;
  amplifierGain: number | null;
  hallMvPerAmp: number | null;
  /** Sensor output in mV per amp (shunt × gain, or the Hall figure); null when unknown. */
  sensitivityMvPerAmp: number | null;
  adcBits: number | null;
  adcReferenceVolts: number | null;
  notes: string | null;
  approvedCount: number;
};

/** The three figures of a revision that are worked out or counted rather than stored. */
type RevisionFigures = Pick<BoardRevisionDetail, "dividerRatio" | "sensitivityMvPerAmp" | "approvedCount">;

/** A revision's stored fields copied field by field (never spread), with its worked-out figures, in the published order. */
export function revisionDetail(r: Omit<BoardRevisionDetail, keyof RevisionFigures>, figures: RevisionFigures): BoardRevisionDetail {
  return {
    id: r.id,
    label: r.label,
    position: r.position,
    releasedOn: r.releasedOn,
    dividerTopOhms: r.dividerTopOhms,
    dividerBottomOhms: r.dividerBottomOhms,
    dividerRatio: figures.dividerRatio,
    currentSensor: r.currentSensor,
    shuntMilliohms: r.shuntMilliohms,
    amplifierGain: r.amplifierGain,
    hallMvPerAmp: r.hallMvPerAmp,
    sensitivityMvPerAmp: figures.sensitivityMvPerAmp,
    adcBits: r.adcBits,
    adcReferenceVolts: r.adcReferenceVolts,
    notes: r.notes,
    approvedCount: figures.approvedCount,
  };
}
