// What a board is and how it senses current; the database keeps the short codes.
export const BOARD_KINDS = ["flight_controller", "aio", "esc_4in1", "pdb", "power_module"] as const;
export type BoardKind = (typeof BOARD_KINDS)[number];

export type CurrentSensorKind = "shunt" | "hall";

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
