import { BOARD_KINDS, type BoardKind } from "@/models/BoardModel";

// Words shown to people for each board kind; the database keeps the short codes.
export const KIND_LABELS: Record<BoardKind, string> = {
  flight_controller: "Flight controller",
  aio: "AIO (flight controller + ESC)",
  esc_4in1: "4-in-1 ESC",
  pdb: "PDB",
  power_module: "Power module",
};

/** Plural headings for the home page's browse-by-kind entry points. */
export const KIND_PLURALS: Record<BoardKind, string> = {
  flight_controller: "Flight controllers",
  aio: "AIO boards",
  esc_4in1: "4-in-1 ESCs",
  pdb: "PDBs",
  power_module: "Power modules",
};

export { BOARD_KINDS, type BoardKind };

export function kindLabel(kind: string): string {
  return (KIND_LABELS as Record<string, string>)[kind] ?? kind;
}
