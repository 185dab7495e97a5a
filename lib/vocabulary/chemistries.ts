// Pack chemistries a garage pack may have; their cell voltages live with the worksheet arithmetic.
export const CHEMISTRIES = ["lipo", "lihv", "liion"] as const;
export type Chemistry = (typeof CHEMISTRIES)[number];
