import { describe, expect, it } from "vitest";
import { CHOSEN_BECAUSE, resolveSelection } from "@/components/values/selection";
import type { BoardValues } from "@/lib/published/board-values-types";

// The board page says why it shows the revision and family it does (the daily-paths issue: "the
// revision and family it shows were picked for the builder without saying so").

const group = (family: string, n: number) => ({ family, voltageScale: { n }, currentScale: null, currentOffset: null });
const overview = {
  families: [{ slug: "a" }, { slug: "b" }],
  revisions: [
    { label: "v1", families: [group("a", 9), group("b", 2)] },
    { label: "v2", families: [group("b", 4)] },
  ],
} as unknown as BoardValues;
const revisions = [
  { label: "v1", position: 0 },
  { label: "v2", position: 1 },
  { label: "v3", position: 2 },
];

describe("resolveSelection says why", () => {
  it("unasked: the newest revision with values, in its most used family", () => {
    expect(resolveSelection(revisions, overview, {})).toEqual({ selection: { revision: "v2", family: "b" }, notices: [], chosenBecause: "likeliest" });
    expect(CHOSEN_BECAUSE.likeliest).toMatch(/newest revision with values/);
  });

  it("a link naming both: as the link asked", () => {
    expect(resolveSelection(revisions, overview, { revision: "v1", family: "a" }).chosenBecause).toBe("link");
  });

  it("a link naming something that does not exist falls back and says so", () => {
    const r = resolveSelection(revisions, overview, { revision: "v9", family: "a" });
    expect(r.chosenBecause).toBe("likeliest");
    expect(r.notices[0]).toMatch(/no revision "v9"/);
  });
});
