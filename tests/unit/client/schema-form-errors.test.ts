import { describe, expect, it } from "vitest";
import { errorsOf, flatErrors } from "@/components/form-errors";
import { ApiFetchError } from "@/lib/client/api-fetch";

// How the forms place messages (our own convention): by field path, every message of a field kept,
// a message about the whole form under "input"; a refusal naming fields goes on those fields.
describe("form error placement", () => {
  it("flattens react-hook-form's nested errors to paths, with the form-wide message under input", () => {
    const errors = {
      cells: { type: "too_small", message: "At least 1 cell", types: { too_small: "At least 1 cell", custom: ["Odd", "Check it"] } },
      readings: { 0: { measuredVolts: { type: "custom", message: "30 V cannot be right" } } },
      root: { server: { type: "server", message: "The worksheet is published" } },
    };
    expect(flatErrors(errors as never)).toEqual({
      cells: ["At least 1 cell", "Odd", "Check it"],
      "readings.0.measuredVolts": ["30 V cannot be right"],
      input: ["The worksheet is published"],
    });
  });

  it("reads a refusal by field when the server named fields, else as one message", () => {
    expect(errorsOf(new ApiFetchError(400, "Check the fields", { cells: ["Enter the cells"] }))).toEqual({ cells: ["Enter the cells"] });
    expect(errorsOf(new ApiFetchError(409, "Published already"))).toEqual({ input: ["Published already"] });
    expect(errorsOf(null)).toEqual({});
  });
});
