import { recommendValue } from "@/lib/stats";
import type { Response } from "@/lib/vocabulary";

// A worksheet's exact next setting is rarely a whole number, and the firmware stores whole steps.
// Both neighbours are offered with the reading error each leaves. The current scale takes the one on
// the safe side, over-reporting mAh (common practice, no source). The voltage scale takes the
// nearest step unless that reads high by more than a small allowance, then the step that reads
// lower (our own rule): a step reading 0.01 % high is practically exact and beats one reading 0.9 % low.
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
  /** The rounding recommended: the safe side, or the nearest step when it errs by no more than the allowance. */
  recommendedSide: "down" | "up";
  recommended: RoundedSetting;
};

/** The one-sentence why beside a recommended current-scale rounding (common practice, no source). */
export const CURRENT_ROUNDING_WHY =
  "Rounded so the display over-reports mAh: the used-capacity alert then comes early, and the pilot lands early rather than late.";

/**
 * How far the voltage scale's nearest step may read high and still be chosen: 0.1 %, about one
 * display digit (0.01 V) on a 4S–6S pack (our own rule).
 */
export const VOLTAGE_HIGH_ALLOWANCE = 0.001;

/** The same for the voltage scale (our own rule, by analogy with the mAh rule). */
export const VOLTAGE_ROUNDING_WHY = `The nearest whole step, unless it makes the display read more than ${VOLTAGE_HIGH_ALLOWANCE * 100} % high; then the step that reads lower, so the land-soon voltage comes early rather than late.`;

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
 * Both whole-step neighbours of an exact setting, their reading errors, and the recommended one:
 * the safe side, unless the other neighbour errs on the unsafe side by no more than
 * `unsafeAllowance` (a fraction; 0 = always the safe side) and is nearer.
 * The exact value is cut to 12 significant digits first (lib/stats recommendValue), so that
 * 367.00000000000006 counts as 367 rather than offering 368.
 */
export function roundBothWays(exact: number, response: Response, safeReading: SafeReading, range?: SettingRange, unsafeAllowance = 0): SettingRoundings {
  const down = recommendValue(exact, 1, "down")!.setting;
  const up = recommendValue(exact, 1, "up")!.setting;
  const whole = down === up ? down : null;
  const exactOrWhole = whole ?? exact; // a value that rounds to a whole step reads true there
  const pair = { down: rounded(down, exactOrWhole, response, range), up: rounded(up, exactOrWhole, response, range) };
  const safeSide = safeRoundingSide(response, safeReading);
  const otherSide = safeSide === "down" ? "up" : "down";
  const other = pair[otherSide];
  const nearer = Math.abs(other.setting - exactOrWhole) < Math.abs(pair[safeSide].setting - exactOrWhole);
  const recommendedSide = nearer && Math.abs(other.readingError ?? Infinity) <= unsafeAllowance ? otherSide : safeSide;
  return { exact, ...pair, safeSide, recommendedSide, recommended: pair[recommendedSide] };
}
