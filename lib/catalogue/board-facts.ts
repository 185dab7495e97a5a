import type { BoardKind } from "@/lib/vocabulary";

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
