"use client";

import Link from "next/link";
import { useMemo, useState, type ReactNode } from "react";
import { useBoardValues } from "@/components/hooks/use-board-values";
import { plural } from "@/lib/catalogue/format";
import type { BoardValues, QuantityKey } from "@/lib/published/board-values-types";
import { describeDifference, revisionDifferences, type RevisionFacts } from "@/lib/published/revision-differences";
import { DifferenceNotes } from "./difference-notes";
import { DistributionChart } from "./distribution-chart";
import type { PartsFigures } from "./quantity-meaning";
import { RecommendedValue } from "./recommended-value";
import { findGroup, groupSize, type Selection } from "./selection";
import { dayOf } from "./summary";
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
    <div className="rounded-md border-3 border-dashed border-rule bg-surface px-4 py-5" data-testid="no-values">
      <p className="text-lead font-semibold">
        No published values yet for {what} &mdash; <Link href={`/submit?board=${encodeURIComponent(slug)}`}>be the first to contribute</Link>.
      </p>
      <p className="mt-1 text-muted">Calibrate your own board with a multimeter and a charger, and share what you measured.</p>
    </div>
  );
}

export function BoardValuesSection(props: Props) {
  return (
    <section aria-labelledby="values-title" className="space-y-4" id="values">
      {props.initial ? (
        <ValuesExplorer {...props} initial={props.initial} />
      ) : (
        <>
          <Heading />
          <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem] lg:items-start">
            <NoValues slug={props.slug} what="this board" />
            {props.safety}
          </div>
        </>
      )}
    </section>
  );
}

function ValuesExplorer({ slug, revisions, overview, initial, notices, safety }: Props & { initial: NonNullable<Props["initial"]> }) {
  const [selection, setSelection] = useState<Selection>(initial.selection);
  const isInitial = selection.revision === initial.selection.revision && selection.family === initial.selection.family;
  const query = useBoardValues(slug, selection, { initial: isInitial ? initial.values : undefined, keepPrevious: true });

  function choose(next: Selection) {
    setSelection(next);
    const url = new URL(window.location.href);
    url.searchParams.set("revision", next.revision);
    url.searchParams.set("family", next.family);
    window.history.replaceState(null, "", `${url.pathname}${url.search}${url.hash}`);
  }

  const familyName = (family: string) => overview.families.find((f) => f.slug === family)?.name ?? family;

  const revisionOptions = revisions.map((r) => {
    const n = groupSize(findGroup(overview, r.label, selection.family));
    return { value: r.label, label: r.label, hint: n > 0 ? plural(n, "value") : "none yet" };
  });
  const familyOptions = overview.families.map((f) => {
    const n = groupSize(findGroup(overview, selection.revision, f.slug));
    return { value: f.slug, label: f.name, hint: n > 0 ? plural(n, "value") : "none yet" };
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
  const parts: PartsFigures = { dividerRatio: revisionEntry?.dividerRatio ?? null, sensitivityMvPerAmp: revisionEntry?.sensitivityMvPerAmp ?? null };
  const otherFamilies = (overview.revisions.find((r) => r.label === selection.revision)?.families ?? [])
    .filter((g) => g.family !== selection.family)
    .map((g) => familyName(g.family));

  return (
    <>
      <Heading>
        {current && group && (
          <p className="text-small text-muted">
            Last change <time dateTime={group.lastChangeAt}>{dayOf(group.lastChangeAt)}</time>
          </p>
        )}
      </Heading>

      {notices.length > 0 && (
        <p role="status" className="rounded-md border-2 border-rule bg-sunken px-3 py-2">
          {notices.join(" ")}
        </p>
      )}

      <ValuePicker selection={selection} revisions={revisionOptions} families={familyOptions} onChange={choose} />

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
                <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
                  <h3 className={`font-display text-xl font-bold tracking-wide uppercase ${loading ? "opacity-45" : ""}`}>
                    <span className="font-mono normal-case">{shownRevision.label}</span> with {units.name}
                  </h3>
                  {loading && (
                    <span className="rounded-full bg-ink px-3 py-0.5 text-small font-semibold text-paper">
                      Loading {selection.revision} with {familyName(selection.family)}…
                    </span>
                  )}
                </div>
                {/* the previous view stays while the next loads, dimmed and labelled with what it is */}
                <div className={`transition-opacity ${loading ? "opacity-45" : ""}`}>
                  {units.description && <p className="mt-1 max-w-prose text-small text-muted">{units.description}</p>}
                  {group ? (
                    <div className="mt-3 grid gap-3 sm:grid-cols-3">
                      {QUANTITY_KEYS.map((k) => (
                        <RecommendedValue key={k} quantity={k} values={group[k]} units={units} parts={parts} />
                      ))}
                    </div>
                  ) : (
                    <div className="mt-3">
                      <NoValues slug={slug} what="this revision and firmware family" />
                      {otherFamilies.length > 0 && (
                        <p className="mt-2">
                          <span className="font-mono">{selection.revision}</span> has values under{" "}
                          {new Intl.ListFormat("en", { type: "conjunction" }).format(otherFamilies)}.
                        </p>
                      )}
                    </div>
                  )}
                </div>
              </div>
            )
          )}
          <DifferenceNotes notes={notes} />
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
    </>
  );
}
