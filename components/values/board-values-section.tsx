"use client";

import Link from "next/link";
import { useMemo, useState, type ReactNode } from "react";
import { useBoardValues } from "@/components/hooks/use-board-values";
import type { BoardValues, FamilyUnits, QuantityKey } from "@/lib/published/board-values-types";
import type { HistorySeries } from "@/lib/published/history";
import { describeDifference, revisionDifferences, type RevisionFacts } from "@/lib/published/revision-differences";
import { DifferenceNotes } from "./difference-notes";
import { BoardActions } from "./board-actions";
import { DistributionChart } from "./distribution-chart";
import { FromParts } from "./from-parts";
import type { PartsDetail } from "./quantity-meaning";
import { RecommendedValue } from "./recommended-value";
import { CHOSEN_BECAUSE, findGroup, groupSize, type ChosenBecause, type Selection } from "./selection";
import { ValueHistoryList } from "./value-history-timeline";
import { formatDate } from "@/lib/dates/format";
import { ValuePicker } from "./value-picker";

// The board page's published starting values. The server renders the first view (initial); a
// change of revision or firmware family fetches that one group from the public API through
// react-query, without leaving the page, and writes the choice into the address bar with
// history.replaceState (Next.js keeps its router in step and makes no server round trip), so the
// URL stays shareable.

export type RevisionEntry = Omit<RevisionFacts, "values">;

const QUANTITY_KEYS: QuantityKey[] = ["voltageScale", "currentScale", "currentOffset"];

type Props = {
  slug: string;
  /** Every revision of the board with its sensor hardware, oldest first. */
  revisions: RevisionEntry[];
  /** The whole board's figures without points: for the picker's counts and the difference notes. */
  overview: BoardValues;
  /** The first view with points, as the API would send it; null when nothing is published. */
  initial: { selection: Selection; values: BoardValues } | null;
  /** Why the address bar's choice was not used, if it was not. */
  notices: string[];
  /** Why the first view shows the revision and family it does. */
  chosenBecause: ChosenBecause;
  /** Every recorded change of the board's published values; the selected group's come first. */
  history: HistorySeries[];
  /** Every family's units, for settings computed from the parts where nothing is published. */
  families: FamilyUnits[];
  /** The safety box, kept beside the numbers. */
  safety: ReactNode;
};

function Heading({ children }: { children?: ReactNode }) {
  return (
    <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
      <h2 id="values-title" className="font-display text-heading uppercase">
        Starting values
      </h2>
      {children}
    </div>
  );
}

/** The empty state; the contribution form (/submit) opens on this board. */
function NoValues({ slug, what }: { slug: string; what: string }) {
  return (
    <div className="rounded-md border-3 border-dashed border-rule bg-surface px-4 py-4" data-testid="no-values">
      <p className="font-semibold">
        No published values yet for {what} &mdash; <Link href={`/submit?board=${encodeURIComponent(slug)}`}>be the first to send yours</Link>.
      </p>
    </div>
  );
}

const partsOf = (r: RevisionEntry | undefined): PartsDetail => ({
  dividerRatio: r?.dividerRatio ?? null,
  sensitivityMvPerAmp: r?.sensitivityMvPerAmp ?? null,
  currentSensor: r?.currentSensor ?? null,
  shuntMilliohms: r?.shuntMilliohms ?? null,
  amplifierGain: r?.amplifierGain ?? null,
});
const hasParts = (r: RevisionEntry | undefined) => r?.dividerRatio != null || r?.sensitivityMvPerAmp != null;

export function BoardValuesSection(props: Props) {
  // nothing published on the whole board: the newest revision whose parts are on record, worked out in every family
  const newestWithParts = [...props.revisions].sort((a, b) => b.position - a.position).find(hasParts);
  return (
    <section aria-labelledby="values-title" className="space-y-3 sm:space-y-4" id="values">
      {props.initial ? (
        <ValuesExplorer {...props} initial={props.initial} />
      ) : (
        <>
          <Heading />
          <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem] lg:items-start">
            <div className="min-w-0 space-y-3">
              <NoValues slug={props.slug} what="this board" />
              {newestWithParts && props.families.length > 0 && (
                <FromParts revision={newestWithParts.label} parts={partsOf(newestWithParts)} families={props.families} />
              )}
              <BoardActions slug={props.slug} />
            </div>
            {props.safety}
          </div>
        </>
      )}
    </section>
  );
}

/** Which revision and family are shown, why, and the two drop-downs that change them. */
function SelectionBar({ why, children }: { why: string; children: ReactNode }) {
  return (
    <div className="space-y-1" data-testid="selection-bar">
      {children}
      <p className="text-small text-muted" data-testid="chosen-because">
        Shown: {why}.
      </p>
    </div>
  );
}

function ValuesExplorer({ slug, revisions, overview, initial, notices, safety, chosenBecause, history }: Props & { initial: NonNullable<Props["initial"]> }) {
  const [selection, setSelection] = useState<Selection>(initial.selection);
  const [picked, setPicked] = useState(false);
  const isInitial = selection.revision === initial.selection.revision && selection.family === initial.selection.family;
  const query = useBoardValues(slug, selection, { initial: isInitial ? initial.values : undefined, keepPrevious: true });

  function choose(next: Selection) {
    setSelection(next);
    setPicked(true);
    const url = new URL(window.location.href);
    url.searchParams.set("revision", next.revision);
    url.searchParams.set("family", next.family);
    window.history.replaceState(null, "", `${url.pathname}${url.search}${url.hash}`);
  }

  const familyName = (family: string) => overview.families.find((f) => f.slug === family)?.name ?? family;

  const revisionOptions = revisions.map((r) => {
    const n = groupSize(findGroup(overview, r.label, selection.family));
    return { value: r.label, label: r.label, hint: String(n) };
  });
  const familyOptions = overview.families.map((f) => {
    const n = groupSize(findGroup(overview, selection.revision, f.slug));
    return { value: f.slug, label: f.name, hint: String(n) };
  });

  const notes = useMemo(() => {
    const units = overview.families.find((f) => f.slug === selection.family);
    if (!units) return [];
    const facts: RevisionFacts[] = revisions.map((r) => ({ ...r, values: findGroup(overview, r.label, selection.family) }));
    return revisionDifferences(facts, units)
      .filter((d) => d.a === selection.revision || d.b === selection.revision)
      .map((d) => describeDifference(d, selection.revision));
  }, [overview, revisions, selection.family, selection.revision]);

  const data = query.data;
  const shownRevision = data?.revisions[0];
  const units = data?.families[0];
  const current = !!data && shownRevision?.label === selection.revision && units?.slug === selection.family;
  const loading = !current && !query.isError;
  const group = shownRevision?.families[0] ?? null;
  const revisionEntry = revisions.find((r) => r.label === shownRevision?.label);
  const parts = partsOf(revisionEntry);
  const otherFamilies = (overview.revisions.find((r) => r.label === selection.revision)?.families ?? [])
    .filter((g) => g.family !== selection.family)
    .map((g) => familyName(g.family));

  return (
    <>
      <Heading>
        {current && group && (
          <p className="text-small text-muted">
            Last change <time dateTime={group.lastChangeAt}>{formatDate(group.lastChangeAt)}</time>
          </p>
        )}
      </Heading>

      {notices.length > 0 && (
        <p role="status" className="rounded-md border-2 border-rule bg-sunken px-3 py-2">
          {notices.join(" ")}
        </p>
      )}

      <SelectionBar why={picked ? "as you chose" : CHOSEN_BECAUSE[chosenBecause]}>
        <ValuePicker selection={selection} revisions={revisionOptions} families={familyOptions} onChange={choose} />
      </SelectionBar>

      <p className="sr-only" aria-live="polite">
        {loading
          ? `Loading ${selection.revision} with ${familyName(selection.family)}.`
          : current
            ? `Showing ${selection.revision} with ${familyName(selection.family)}.`
            : ""}
      </p>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem] lg:items-start">
        <div className="min-w-0 space-y-4">
          {query.isError && !current ? (
            <div role="alert" className="rounded-md border-3 border-fault bg-fault-wash px-4 py-3">
              <p className="font-semibold text-fault">{query.error.message}</p>
              <button type="button" className="sb-button sb-button-quiet mt-2" onClick={() => query.refetch()}>
                Try again
              </button>
            </div>
          ) : (
            data &&
            units &&
            shownRevision && (
              <div aria-busy={loading} data-testid="values-view" data-shown={`${shownRevision.label}|${units.slug}`}>
                {/* the drop-downs above already say what is shown; the heading is for screen readers' outline */}
                <h3 className="sr-only">
                  {shownRevision.label} with {units.name}
                </h3>
                {loading && (
                  <span className="mb-2 inline-block rounded-full bg-ink px-3 py-0.5 text-small font-semibold text-paper">
                    Loading {selection.revision} with {familyName(selection.family)}…
                  </span>
                )}
                {/* the previous view stays while the next loads, dimmed and labelled with what it is */}
                <div className={`transition-opacity ${loading ? "opacity-45" : ""}`}>
                  {group ? (
                    <div className="grid gap-3 sm:grid-cols-3">
                      {QUANTITY_KEYS.map((k) => (
                        <RecommendedValue key={k} quantity={k} values={group[k]} units={units} parts={parts} />
                      ))}
                    </div>
                  ) : (
                    <div className="mt-3 space-y-3">
                      <NoValues slug={slug} what="this revision and firmware family" />
                      {hasParts(revisionEntry) && <FromParts revision={shownRevision.label} parts={parts} families={[units]} />}
                      {otherFamilies.length > 0 && (
                        <p className="mt-2">
                          <span className="font-mono">{selection.revision}</span> has values under{" "}
                          {new Intl.ListFormat("en", { type: "conjunction" }).format(otherFamilies)}.
                        </p>
                      )}
                    </div>
                  )}
                  {units.description && (
                    <p className="mt-2 max-w-prose text-small text-muted">
                      {units.name}: {units.description}
                    </p>
                  )}
                </div>
              </div>
            )
          )}
          <DifferenceNotes notes={notes} />
          <BoardActions slug={slug} />
        </div>
        {safety}
      </div>

      {data && group && units && !(query.isError && !current) && (
        <div aria-busy={loading} className={`space-y-2 ${loading ? "opacity-45" : ""}`}>
          <h3 className="font-display text-xl font-bold tracking-wide uppercase">How the values spread</h3>
          <div className="grid gap-4 lg:grid-cols-3">
            {QUANTITY_KEYS.map((k) => {
              const q = group[k];
              return q ? <DistributionChart key={k} quantity={k} values={q} units={units} /> : null;
            })}
          </div>
        </div>
      )}
      <ValueHistoryList series={history} selection={selection} />
    </>
  );
}
