import type { BoardValues, GroupValues, QuantityKey } from "@/lib/published/board-values-types";

// Which revision and firmware family the values section opens on, from the address bar when it
// names ones that exist, else the likeliest: the newest revision with published values, and the
// family with the most values in it. Pure, so the server page and the client agree.

export type Selection = { revision: string; family: string };

/** Why the page opened on its selection, in words for the page: the builder did not pick it. */
export const CHOSEN_BECAUSE = {
  link: "as the link asked",
  likeliest: "the newest revision with values, in its most used firmware family",
} as const;
export type ChosenBecause = keyof typeof CHOSEN_BECAUSE;
export type RevisionOption = { label: string; position: number };

const KEYS: QuantityKey[] = ["voltageScale", "currentScale", "currentOffset"];

/** Values behind a group: the largest n of its quantities (one submission gives up to three values). */
export function groupSize(group: GroupValues | null | undefined): number {
  if (!group) return 0;
  return Math.max(0, ...KEYS.map((k) => group[k]?.n ?? 0));
}

/** The group of one revision (by label) under one family in a values view, or null. */
export function findGroup(values: BoardValues, revision: string, family: string): GroupValues | null {
  const r = values.revisions.find((x) => x.label === revision);
  return r?.families.find((g) => g.family === family) ?? null;
}

/** Shown in a notice; an address bar can hold anything, so keep it short. */
const quoted = (s: string) => JSON.stringify(s.length > 40 ? `${s.slice(0, 40)}…` : s);

export function resolveSelection(
  revisions: readonly RevisionOption[],
  overview: BoardValues,
  asked: { revision?: string; family?: string },
): { selection: Selection | null; notices: string[]; chosenBecause: ChosenBecause } {
  const notices: string[] = [];
  const families = overview.families;
  if (revisions.length === 0 || families.length === 0) return { selection: null, notices, chosenBecause: "likeliest" };

  const byNewest = [...revisions].sort((a, b) => b.position - a.position);
  let revision: string | undefined;
  if (asked.revision) {
    revision = revisions.find((r) => r.label.toLowerCase() === asked.revision!.trim().toLowerCase())?.label;
    if (!revision) notices.push(`This board has no revision ${quoted(asked.revision)}.`);
  }
  revision ??= byNewest.find((r) => overview.revisions.find((x) => x.label === r.label)?.families.length)?.label ?? byNewest[0].label;

  let family: string | undefined;
  if (asked.family) {
    family = families.find((f) => f.slug === asked.family!.trim())?.slug;
    if (!family) notices.push(`No firmware family with values for this board is called ${quoted(asked.family)}.`);
  }
  if (!family) {
    // the family with most values in this revision; ties (and a revision without values) go to
    // the family with most values on the whole board
    const boardSize = (slug: string) => overview.revisions.reduce((sum, r) => sum + groupSize(r.families.find((g) => g.family === slug)), 0);
    const ranked = [...families].sort(
      (a, b) => groupSize(findGroup(overview, revision!, b.slug)) - groupSize(findGroup(overview, revision!, a.slug)) || boardSize(b.slug) - boardSize(a.slug),
    );
    family = ranked[0].slug;
  }
  if (notices.length > 0) {
    const name = families.find((f) => f.slug === family)!.name;
    notices.push(`Showing ${revision} with ${name} instead.`);
  }
  const chosenBecause: ChosenBecause = asked.revision && asked.family && notices.length === 0 ? "link" : "likeliest";
  return { selection: { revision, family }, notices, chosenBecause };
}
