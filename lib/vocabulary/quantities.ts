// The three calibrated settings Shuntbook publishes, each a column of `submissions`.
export const QUANTITIES = ["voltage_scale", "current_scale", "current_offset"] as const;
export type Quantity = (typeof QUANTITIES)[number];

export const QUANTITY_LABELS: Record<Quantity, string> = {
  voltage_scale: "Voltage scale",
  current_scale: "Current scale",
  current_offset: "Current offset",
};
