// The kinds of saved calibration worksheet, one per measuring method that keeps a worksheet.
export const WORKSHEET_KINDS = ["fly_recharge", "voltage", "bench"] as const;
export type WorksheetKind = (typeof WORKSHEET_KINDS)[number];
