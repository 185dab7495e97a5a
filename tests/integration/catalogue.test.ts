import { QueryTypes } from "sequelize";
import { beforeAll, describe, expect, it } from "vitest";
import { getBoardBySlug } from "@/lib/catalogue/get-board";
import { getHomeCounts } from "@/lib/catalogue/home-counts";
import { listBoards, type CatalogueRow } from "@/lib/catalogue/list-boards";
import { listMountingPatterns } from "@/lib/catalogue/mounting-patterns";
import { DEFAULT_PAGE_SIZE, parseCatalogueParams, type CatalogueParams } from "@/lib/catalogue/search-params";
import { DEMO_LANDMARKS, buildDemoScenario } from "@/seeders/demo/scenario";
import { db } from "@/models";
import { BOARD_KINDS } from "@/lib/vocabulary";
import { setupTestDatabase } from "@/tests/support/database";

setupTestDatabase("seeded");

// What the seeder inserted, rebuilt from the same source (seeders/demo) so that expectations follow
// the scenario instead of hard-coded counts. The catalogue part does not depend on the date.
const scenario = buildDemoScenario();
const allSlugs = scenario.boardModels.map((b) => b.slug);

/** Parses like the page does, failing the test on a parameter error. */
function params(input: Record<string, string | string[] | undefined>): CatalogueParams {
  const parsed = parseCatalogueParams(input);
  if (!parsed.ok) throw new Error(`unexpected field errors: ${JSON.stringify(parsed.fieldErrors)}`);
  return parsed.params;
}

const list = (input: Record<string, string>) => listBoards(params(input));

/** Every row of a filtered listing, page by page, so that tests see the whole result set. */
async function everyRow(input: Record<string, string>): Promise<CatalogueRow[]> {
  const first = await list({ ...input, pageSize: "100" });
  const rows = [...first.rows];
  for (let page = 2; page <= first.pageCount; page++) rows.push(...(await list({ ...input, pageSize: "100", page: String(page) })).rows);
  return rows;
}

// Counted straight from the tables, independently of the catalogue query's lateral joins.
let approvedBySlug: Map<string, number>;
beforeAll(async () => {
  const rows = await db().query<{ slug: string; n: number }>(
    `SELECT bm.slug, count(s.id) FILTER (WHERE s.status = 'approved') AS n
       FROM board_models bm
       LEFT JOIN board_revisions br ON br.board_model_id = bm.id
       LEFT JOIN submissions s ON s.board_revision_id = br.id
      GROUP BY bm.slug`,
    { type: QueryTypes.SELECT },
  );
  approvedBySlug = new Map(rows.map((r) => [r.slug, r.n]));
});

describe("search (pg_trgm over names, aliases and makers)", () => {
  it("relies on pg_trgm's documented word_similarity (PostgreSQL docs, pg_trgm: word_similarity('word', 'two words') = 0.8; from memory)", async () => {
    const [row] = await db().query<{ w: number }>("SELECT word_similarity('word', 'two words') AS w", { type: QueryTypes.SELECT });
    expect(row.w).toBeCloseTo(0.8, 6);
  });

  it.each(DEMO_LANDMARKS.distinctiveAliases.map((a) => [a.alias, a.boardSlug]))("finds the board by its alias %s", async (alias, slug) => {
    const result = await list({ q: alias });
    expect(result.rows[0]?.slug).toBe(slug);
  });

  it.each(DEMO_LANDMARKS.misspellings.map((m) => [m.query, m.boardSlug]))("finds the board for the misspelling %s, ranked first", async (query, slug) => {
    const result = await list({ q: query });
    expect(result.rows[0]?.slug).toBe(slug);
    expect(result.rows[0]?.score).toBeGreaterThan(0);
  });

  it("finds every board of a maker by the maker's name alone", async () => {
    const maker = scenario.manufacturers.find((m) => m.slug === "copperlode")!;
    const expected = scenario.boardModels.filter((b) => b.manufacturerSlug === maker.slug).map((b) => b.slug);
    const rows = await everyRow({ q: maker.name });
    expect(rows.map((r) => r.slug)).toEqual(expect.arrayContaining(expected));
  });

  it("treats LIKE wildcards in the search text as plain characters", async () => {
    const result = await list({ q: "%_%" });
    expect(result.total).toBe(0);
  });

  it("returns nothing, not an error, for text that matches no board", async () => {
    const result = await list({ q: "qqqq zzzz xxxx" });
    expect(result).toMatchObject({ total: 0, rows: [], page: 1, pageCount: 1 });
  });
});

describe("filters", () => {
  it.each(BOARD_KINDS)("kind=%s lists exactly the boards of that kind", async (kind) => {
    const rows = await everyRow({ kind });
    const expected = scenario.boardModels.filter((b) => b.kind === kind).map((b) => b.slug);
    expect(rows.map((r) => r.slug).sort()).toEqual([...expected].sort());
    expect(rows.every((r) => r.kind === kind)).toBe(true);
  });

  it("mounting lists exactly the boards with that hole spacing, for every pattern in use", async () => {
    const patterns = await listMountingPatterns();
    expect([...patterns].sort()).toEqual([...new Set(scenario.boardModels.map((b) => b.mountingPattern))].sort());
    for (const mounting of patterns) {
      const rows = await everyRow({ mounting });
      const expected = scenario.boardModels.filter((b) => b.mountingPattern === mounting).map((b) => b.slug);
      expect(rows.map((r) => r.slug).sort()).toEqual([...expected].sort());
    }
  });

  it("kind, mounting and search combine with AND", async () => {
    const rows = await everyRow({ kind: "flight_controller", mounting: "30.5x30.5", q: "F7" });
    expect(rows.length).toBeGreaterThan(0);
    for (const r of rows) {
      expect(r).toMatchObject({ kind: "flight_controller", mountingPattern: "30.5x30.5" });
    }
    const everyFc305 = scenario.boardModels.filter((b) => b.kind === "flight_controller" && b.mountingPattern === "30.5x30.5");
    expect(rows.length).toBeLessThan(everyFc305.length);
  });
});

describe("paging", () => {
  it("splits the catalogue into pages with the right sizes, totals and no overlap", async () => {
    const pageSize = 7;
    const first = await list({ pageSize: String(pageSize) });
    expect(first.total).toBe(allSlugs.length);
    expect(first.pageCount).toBe(Math.ceil(allSlugs.length / pageSize));

    const seen: string[] = [];
    for (let page = 1; page <= first.pageCount; page++) {
      const result = await list({ pageSize: String(pageSize), page: String(page) });
      expect(result).toMatchObject({ page, pageSize, total: allSlugs.length, pageCount: first.pageCount });
      const expectedSize = page < first.pageCount ? pageSize : allSlugs.length - pageSize * (first.pageCount - 1);
      expect(result.rows).toHaveLength(expectedSize);
      seen.push(...result.rows.map((r) => r.slug));
    }
    expect(new Set(seen).size).toBe(seen.length); // no board on two pages
    expect([...seen].sort()).toEqual([...allSlugs].sort()); // and none left out
  });

  it("uses the default page size when none is given", async () => {
    const result = await list({});
    expect(result.rows).toHaveLength(Math.min(DEFAULT_PAGE_SIZE, allSlugs.length));
  });

  it("answers a page past the end with no rows but the true total and page count", async () => {
    const result = await list({ page: "999" });
    expect(result.rows).toEqual([]);
    expect(result.total).toBe(allSlugs.length);
    expect(result.pageCount).toBe(Math.ceil(allSlugs.length / DEFAULT_PAGE_SIZE));
  });

  it("pages a filtered search too, without overlap", async () => {
    const all = await everyRow({ q: "4in1" });
    const paged: string[] = [];
    const first = await list({ q: "4in1", pageSize: "3" });
    for (let page = 1; page <= first.pageCount; page++) paged.push(...(await list({ q: "4in1", pageSize: "3", page: String(page) })).rows.map((r) => r.slug));
    expect(paged).toEqual(all.map((r) => r.slug));
  });
});

describe("sort orders", () => {
  const nameKey = (r: CatalogueRow) => r.name.toLowerCase();

  it("name: A to Z by code point of the lower-cased name", async () => {
    const rows = await everyRow({ sort: "name" });
    const names = rows.map(nameKey);
    expect(names).toEqual([...names].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0)));
  });

  it("values: most approved values first, and the counts match the submissions table", async () => {
    const rows = await everyRow({ sort: "values" });
    for (const r of rows) expect(r.approvedCount).toBe(approvedBySlug.get(r.slug));
    for (let i = 1; i < rows.length; i++) expect(rows[i - 1].approvedCount).toBeGreaterThanOrEqual(rows[i].approvedCount);
    expect(rows[0].approvedCount).toBeGreaterThan(rows[rows.length - 1].approvedCount);
  });

  it("newest: latest revision release first, boards without a date last", async () => {
    const rows = await everyRow({ sort: "newest" });
    const dates = rows.map((r) => r.latestReleasedOn);
    const firstNull = dates.indexOf(null);
    const dated = (firstNull === -1 ? dates : dates.slice(0, firstNull)) as string[];
    if (firstNull !== -1) expect(dates.slice(firstNull).every((d) => d === null)).toBe(true);
    for (let i = 1; i < dated.length; i++) expect(dated[i - 1] >= dated[i]).toBe(true);
  });

  it("relevance: best score first; it is the default whenever there is search text", async () => {
    const p = params({ q: "Bramble" });
    expect(p.sort).toBe("relevance");
    const rows = await everyRow({ q: "Bramble" });
    for (let i = 1; i < rows.length; i++) expect(rows[i - 1].score!).toBeGreaterThanOrEqual(rows[i].score!);
  });

  it("relevance without search text falls back to name order", async () => {
    expect(params({ sort: "relevance" }).sort).toBe("name");
    const [byName, byRelevance] = await Promise.all([list({ sort: "name" }), list({ sort: "relevance" })]);
    expect(byRelevance.rows.map((r) => r.slug)).toEqual(byName.rows.map((r) => r.slug));
  });
});

describe("parseCatalogueParams field errors", () => {
  it.each([
    ["page", { page: "abc" }],
    ["page", { page: "-1" }],
    ["page", { page: "0" }],
    ["page", { page: "1.5" }],
    ["page", { page: "10001" }],
    ["pageSize", { pageSize: "1000" }],
    ["kind", { kind: "bogus" }],
    ["sort", { sort: "xyz" }],
    ["q", { q: "x".repeat(101) }],
    ["mounting", { mounting: "big" }],
    ["sort", { sort: ["name", "newest"] }],
  ] as const)("rejects a bad %s with a message on that field: %j", (field, input) => {
    const parsed = parseCatalogueParams(input as Record<string, string | string[]>);
    expect(parsed.ok).toBe(false);
    if (parsed.ok) return;
    expect(Object.keys(parsed.fieldErrors)).toEqual([field]);
    expect(parsed.fieldErrors[field][0]).toMatch(new RegExp(field));
  });

  it("names every bad field at once", () => {
    const parsed = parseCatalogueParams({ page: "abc", kind: "bogus", sort: "xyz", q: "x".repeat(101) });
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(Object.keys(parsed.fieldErrors).sort()).toEqual(["kind", "page", "q", "sort"]);
  });

  it("takes empty fields as absent (a GET form sends them all), ignores unknown ones, trims and normalises", () => {
    expect(parseCatalogueParams({ q: "  ", kind: "", mounting: "", sort: "", page: "", utm_source: "forum" })).toEqual({
      ok: true,
      params: { q: undefined, kind: undefined, mounting: undefined, sort: "name", page: 1, pageSize: DEFAULT_PAGE_SIZE },
    });
    expect(parseCatalogueParams({ q: " Wisp ", mounting: "20X20", page: "2", pageSize: "50" })).toEqual({
      ok: true,
      params: { q: "Wisp", kind: undefined, mounting: "20x20", sort: "relevance", page: 2, pageSize: 50 },
    });
  });

  it("accepts the longest search text allowed (100 characters)", () => {
    expect(parseCatalogueParams({ q: "x".repeat(100) }).ok).toBe(true);
  });
});

describe("board page data", () => {
  it("returns null for an unknown or malformed slug", async () => {
    expect(await getBoardBySlug("no-such-board")).toBeNull();
    expect(await getBoardBySlug("Not A Slug!")).toBeNull();
  });

  it("loads a board with maker, aliases, revisions in position order and per-revision approved counts", async () => {
    const { boardSlug } = DEMO_LANDMARKS.hardwareChange;
    const board = (await getBoardBySlug(boardSlug))!;
    const spec = scenario.boardModels.find((b) => b.slug === boardSlug)!;
    expect(board).toMatchObject({ slug: boardSlug, name: spec.name, kind: spec.kind, mountingPattern: spec.mountingPattern });
    expect(board.manufacturer.slug).toBe(spec.manufacturerSlug);
    expect([...board.aliases].sort()).toEqual(
      scenario.boardAliases
        .filter((a) => a.boardSlug === boardSlug)
        .map((a) => a.alias)
        .sort(),
    );
    const expectedLabels = scenario.boardRevisions
      .filter((r) => r.boardSlug === boardSlug)
      .sort((a, b) => a.position - b.position)
      .map((r) => r.label);
    expect(board.revisions.map((r) => r.label)).toEqual(expectedLabels);

    const counted = await db().query<{ id: number; n: number }>(
      "SELECT board_revision_id AS id, count(*) AS n FROM submissions WHERE status = 'approved' AND board_revision_id IN (:ids) GROUP BY 1",
      { replacements: { ids: board.revisions.map((r) => r.id) }, type: QueryTypes.SELECT },
    );
    for (const r of board.revisions) expect(r.approvedCount).toBe(counted.find((c) => c.id === r.id)?.n ?? 0);
    expect(board.revisions.reduce((s, r) => s + r.approvedCount, 0)).toBe(approvedBySlug.get(boardSlug));
  });

  it("derives divider ratio and sensitivity from the hardware (handbook and Ohm's-law worked examples)", async () => {
    // Voltage divider, Vout = Vin·R2/(R1+R2) (Horowitz & Hill, The Art of Electronics, §1.2.3; from
    // memory): 10 kΩ over 1 kΩ divides by 11. brackenwell-f7-wide v1 uses that pair.
    const wide = (await getBoardBySlug("brackenwell-f7-wide"))!;
    const v1 = wide.revisions.find((r) => r.label === "v1")!;
    expect([v1.dividerTopOhms, v1.dividerBottomOhms]).toEqual([10_000, 1_000]);
    expect(v1.dividerRatio).toBeCloseTo(11, 12);
    // Shunt and amplifier, sensitivity = R × gain (Ohm's law): 0.6 mΩ × 45 = 27 mV/A, and
    // 0.3 mΩ × 45 = 13.5 mV/A (Ohm's law: sensitivity = R_shunt × gain). The hardware-change landmark has both.
    const tinsel = (await getBoardBySlug(DEMO_LANDMARKS.hardwareChange.boardSlug))!;
    const [before, after] = [DEMO_LANDMARKS.hardwareChange.before, DEMO_LANDMARKS.hardwareChange.after].map((label) =>
      tinsel.revisions.find((r) => r.label === label)!,
    );
    expect(before).toMatchObject({ currentSensor: "shunt", shuntMilliohms: 0.6, amplifierGain: 45 });
    expect(before.sensitivityMvPerAmp).toBeCloseTo(27, 12);
    expect(after.sensitivityMvPerAmp).toBeCloseTo(13.5, 12);
  });

  it("keeps unknown hardware as null rather than inventing it", async () => {
    const spec = scenario.boardRevisions.find((r) => r.dividerTopOhms == null)!;
    const board = (await getBoardBySlug(spec.boardSlug))!;
    const revision = board.revisions.find((r) => r.label === spec.label)!;
    expect(revision).toMatchObject({ dividerTopOhms: null, dividerBottomOhms: null, dividerRatio: null });
  });
});

describe("home counts", () => {
  it("matches the tables", async () => {
    const counts = await getHomeCounts();
    expect(counts.boards).toBe(scenario.boardModels.length);
    expect(counts.revisions).toBe(scenario.boardRevisions.length);
    expect(counts.approvedValues).toBe([...approvedBySlug.values()].reduce((a, b) => a + b, 0));
    for (const kind of BOARD_KINDS) {
      expect(counts.boardsByKind[kind] ?? 0).toBe(scenario.boardModels.filter((b) => b.kind === kind).length);
    }
  });
});
