import { z } from "zod";
import { numberField, positiveNumber } from "./fields";
import { WorksheetInputError, parseInput } from "./result";

// ADC conversion for the hardware worksheet. We use 1 LSB = Vref / 2^N, the usual form and the
// IEEE Std 1241 definition (from memory). Some documentation divides by 2^N − 1
// instead; at 12 bits the two differ by 0.024 %, far below any setting step, but the choice is
// named here so that the figures can be checked: 12 bits, 3.3 V, count 2048 → 1.650000 V.

const MAX_ADC_BITS = 24;

const adcSchema = z.object({
  vrefVolts: positiveNumber("The ADC reference", "V", 10),
  bits: numberField("The ADC resolution")
    .int("The ADC resolution is a whole number of bits, like 12")
    .min(1, "The ADC resolution is at least 1 bit")
    .max(MAX_ADC_BITS, `The ADC resolution is at most ${MAX_ADC_BITS} bits`),
});

export type AdcSpec = { vrefVolts: number; bits: number };

function checkedAdc(adc: AdcSpec, field = "adc"): AdcSpec {
  const parsed = parseInput(adcSchema, adc);
  if ("errors" in parsed) throw new WorksheetInputError(parsed.errors.map((e) => ({ ...e, field: `${field}.${e.field}` })));
  return parsed.data;
}

/** The validation of an ADC description, for worksheets that collect errors instead of throwing. */
export const adcSpecSchema = adcSchema;

/** Volts per count: Vref / 2^N (IEEE Std 1241 form). */
export function adcLsbVolts(adc: AdcSpec): number {
  const { vrefVolts, bits } = checkedAdc(adc);
  return vrefVolts / 2 ** bits;
}

/** The pin voltage a count stands for: count × LSB. Counts run from 0 to 2^N − 1. */
export function adcCountToVolts(count: number, adc: AdcSpec): number {
  const { bits } = checkedAdc(adc);
  const max = 2 ** bits - 1;
  if (!Number.isInteger(count) || count < 0 || count > max) {
    throw new WorksheetInputError([{ field: "count", message: `An ADC count is a whole number from 0 to ${max} at ${bits} bits (got ${String(count)})` }]);
  }
  return count * adcLsbVolts(adc);
}

/** The pack voltage a count stands for behind a divider of the given ratio (Vin = Vpin × ratio). */
export function packVoltsFromAdcCount(count: number, adc: AdcSpec, dividerRatio: number): number {
  if (!(typeof dividerRatio === "number" && Number.isFinite(dividerRatio) && dividerRatio >= 1)) {
    throw new WorksheetInputError([{ field: "dividerRatio", message: `A divider ratio is at least 1 (pack volts per pin volt; got ${String(dividerRatio)})` }]);
  }
  return adcCountToVolts(count, adc) * dividerRatio;
}
