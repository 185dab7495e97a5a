import { recommendValue } from "@/lib/stats";
import type { Response } from "@/lib/vocabulary";

// A worksheet's exact next setting is rarely a whole number, and the firmware stores whole steps.
// Both neighbours are offered with the reading error each leaves, and the one on the safe side is
// recommended (common practice, no source).
//
// The reading error of a setting s against the exact setting s* (which makes the display read the
// truth): the display is proportional to the setting, or to its reciprocal —
//   response 'proportional': displayed ÷ true = s ÷ s*;
//   response 'inverse':      displayed ÷ true = s* ÷ s.
// So a larger setting reads high on a proportional unit and low on an inverse one.

/** Which way the display may err without harm: mAh high (land early), volts low (warning early). */
export type SafeReading = "high" | "low";

export type RoundedSetting = {
  /** The whole number of steps to enter. */
  setting: number;
  /** Predicted displayed ÷ true − 1 with this setting: 0.012 reads 1.2 % high. Null for a setting of 0 or less. */
  readingError: number | null;
  reads: "high" | "low" | "true";
  /** Inside the family's setting range (always true when no range was given). */
  withinRange: boolean;
};

export type SettingRoundings = {
  /** The exact, unrounded setting in steps. */
  exact: number;
  /** floor(exact) and ceil(exact); the same setting when exact is whole. */
  down: RoundedSetting;
  up: RoundedSetting;
  /** The rounding that keeps the display on the safe side. */
  safeSide: "down" | "up";
  recommended: RoundedSetting;
};

/** The one-sentence why beside a recommended current-scale rounding (common practice, no source). */
export const CURRENT_ROUNDING_WHY =
  "Rounded so the display over-reports mAh: the used-capacity alert then comes early, and the pilot lands early rather than late.";

/** The same for the voltage scale, whose safe side is reading low (our own rule, by analogy with the mAh rule). */
export const VOLTAGE_ROUNDING_WHY =
  "Rounded so the display reads slightly low: the land-soon voltage then comes early, and the pilot lands early rather than late.";

export type SettingRange = { min: number; max: number };

/** displayed ÷ true − 1 for `setting` where `exact` reads true (see the header). */
export function predictedReadingError(setting: number, exact: number, response: Response): number {
  return response === "proportional" ? setting / exact - 1 : exact / setting - 1;
}

/** The rounding direction that makes the display read on the wanted side, for a unit's response. */
export function safeRoundingSide(response: Response, safeReading: SafeReading): "down" | "up" {
  // proportional: a larger setting reads higher; inverse: a larger setting reads lower
  const largerReadsHigh = response === "proportional";
  return largerReadsHigh === (safeReading === "high") ? "up" : "down";
}

function rounded(setting: number, exact: number, response: Response, range?: SettingRange): RoundedSetting {
  const error = setting > 0 ? predictedReadingError(setting, exact, response) : null;
  const reads = setting === exact ? "true" : error != null && error > 0 ? "high" : "low";
  return { setting, readingError: setting === exact ? 0 : error, reads, withinRange: !range || (setting >= range.min && setting <= range.max) };
}

/**
 * Both whole-step neighbours of an exact setting, their reading errors, and the safe one.
 * The exact value is cut to 12 significant digits first (lib/stats recommendValue), so that
 * 367.00000000000006 counts as 367 rather than offering 368.
 */
export function roundBothWays(exact: number, response: Response, safeReading: SafeReading, range?: SettingRange): SettingRoundings {
  const down = recommendValue(exact, 1, "down")!.setting;
  const up = recommendValue(exact, 1, "up")!.setting;
  const whole = down === up ? down : null;
  const exactOrWhole = whole ?? exact; // a value that rounds to a whole step reads true there
  const pair = { down: rounded(down, exactOrWhole, response, range), up: rounded(up, exactOrWhole, response, range) };
  const safeSide = safeRoundingSide(response, safeReading);
  return { exact, ...pair, safeSide, recommended: pair[safeSide] };
}
