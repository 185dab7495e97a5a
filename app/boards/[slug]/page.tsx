import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { cache, type ReactNode } from "react";
import { RevisionHardware } from "@/components/revision-hardware";
import { SafetyNote } from "@/components/safety-note";
import { BoardValuesSection, type RevisionEntry } from "@/components/values/board-values-section";
import { resolveSelection } from "@/components/values/selection";
import { formatCells, formatMounting } from "@/lib/catalogue/format";
import { getBoardBySlug } from "@/lib/catalogue/get-board";
import { kindLabel } from "@/lib/catalogue/kinds";
import { catalogueQueryString } from "@/lib/catalogue/search-params";
import { getBoardValues, listFamilyUnits, type BoardValues } from "@/lib/published/board-values";
import { getValueHistory } from "@/lib/published/history";
import { TitledSection } from "@/components/titled-section";

export const dynamic = "force-dynamic";

type Props = { params: Promise<{ slug: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

const firstString = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

/**
 * The values section's first view: the selection from ?revision=&family= (or the likeliest one),
 * that group with its points as the API would send it, and the whole board's figures without
 * points for the picker and the difference notes. Both come from the same in-memory cache.
 */
async function loadValues(slug: string, asked: { revision?: string; family?: string }) {
  const overviewResult = await getBoardValues(slug);
  if (!overviewResult?.ok) return null;
  const overview = overviewResult.values;
  const { selection, notices, chosenBecause } = resolveSelection(overview.revisions, overview, asked);
  let initial: { selection: NonNullable<typeof selection>; values: BoardValues } | null = null;
  if (selection) {
    const view = await getBoardValues(slug, { ...selection, points: true });
    if (view?.ok) initial = { selection, values: view.values };
  }
  return { overview, initial, notices, chosenBecause };
}

// metadata and the page read the same board: one query per request
const loadBoard = cache(getBoardBySlug);

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const board = await loadBoard((await params).slug);
  // notFound() here as well as in the page: metadata is resolved first, so the 404 is decided
  // before any HTML streams and the not-found page is rendered on the server
  if (!board) notFound();
  return {
    title: `${board.name} by ${board.manufacturer.name}`,
    description: `Sensor hardware and community calibration values for the ${board.manufacturer.name} ${board.name}, per revision.`,
  };
}

export default async function BoardPage({ params, searchParams }: Props) {
  const board = await loadBoard((await params).slug);
  if (!board) notFound();
  const query = await searchParams;
  const [values, history] = await Promise.all([
    loadValues(board.slug, { revision: firstString(query.revision), family: firstString(query.family) }),
    getValueHistory(board.slug),
  ]);
  // only a board with nothing published needs every family, for its settings computed from the parts
  const families = values?.initial ? [] : await listFamilyUnits();
  const revisionEntries: RevisionEntry[] = board.revisions.map((r) => ({
    label: r.label,
    position: r.position,
    dividerRatio: r.dividerRatio,
    currentSensor: r.currentSensor,
    shuntMilliohms: r.shuntMilliohms,
    amplifierGain: r.amplifierGain,
    sensitivityMvPerAmp: r.sensitivityMvPerAmp,
  }));

  const facts: { term: string; value: ReactNode }[] = [
    {
      term: "Mounting (mm)",
      value: (
        <Link
          href={`/boards${catalogueQueryString({ mounting: board.mountingPattern })}`}
          className="font-mono whitespace-nowrap"
          aria-label={`${formatMounting(board.mountingPattern)} millimetres: show boards with this mounting`}
        >
          {formatMounting(board.mountingPattern)}
        </Link>
      ),
    },
    { term: "Cells", value: formatCells(board.minCells, board.maxCells) },
    { term: "Revisions", value: board.revisions.length },
    { term: "Approved values", value: board.revisions.reduce((sum, r) => sum + r.approvedCount, 0) },
  ];

  return (
    <div className="space-y-4 sm:space-y-8">
      {/* on a phone the menu's "Boards" is the way back, and the first screen is kept for the values */}
      <nav aria-label="Breadcrumb" className="hidden sm:block">
        <ol className="flex flex-wrap items-center gap-2 text-small">
          <li>
            <Link href="/boards">Boards</Link>
          </li>
          <li aria-hidden="true" className="text-muted">
            /
          </li>
          <li>
            <span aria-current="page">{board.name}</span>
          </li>
        </ol>
      </nav>

      <header>
        <h1 className="font-display text-heading uppercase sm:text-title">{board.name}</h1>
        <p className="mt-1 sm:text-lead">
          <Link href={`/boards${catalogueQueryString({ kind: board.kind })}`} className="font-display font-bold tracking-wider uppercase">
            {kindLabel(board.kind)}
          </Link>{" "}
          by{" "}
          {board.manufacturer.website ? (
            <a href={board.manufacturer.website} rel="external noopener noreferrer" className="font-semibold">
              {board.manufacturer.name}
            </a>
          ) : (
            <strong>{board.manufacturer.name}</strong>
          )}
        </p>
      </header>

      {/* the numbers a pilot came for, first on a phone, with the safety box beside them; the facts follow */}
      <BoardValuesSection
        slug={board.slug}
        revisions={revisionEntries}
        overview={
          values?.overview ?? {
            board: { slug: board.slug, name: board.name, kind: board.kind, manufacturer: board.manufacturer },
            families: [],
            revisions: [],
            lastChangeAt: null,
          }
        }
        initial={values?.initial ?? null}
        notices={values?.notices ?? []}
        chosenBecause={values?.chosenBecause ?? "likeliest"}
        history={history?.series ?? []}
        families={families}
        safety={<SafetyNote />}
      />

      <dl className="grid grid-cols-2 gap-px overflow-hidden rounded-md border-3 border-rule bg-rule sm:grid-cols-4">
        {facts.map((f) => (
          <div key={f.term} className="bg-surface px-4 py-3">
            <dt className="font-display text-base font-semibold tracking-wide text-muted uppercase">{f.term}</dt>
            <dd className="mt-1 font-mono text-lg">{f.value}</dd>
          </div>
        ))}
      </dl>

      <div className="space-y-6">
        <div>
          <h2 className="font-display text-lg font-bold tracking-wide uppercase">Also known as</h2>
          {board.aliases.length > 0 ? (
            <ul className="mt-2 flex flex-wrap gap-2">
              {board.aliases.map((alias) => (
                <li key={alias} className="rounded-full border-2 border-rule-soft bg-surface px-3 py-1">
                  {alias}
                </li>
              ))}
            </ul>
          ) : (
            <p className="mt-1 sb-unknown">no other names on record</p>
          )}
        </div>

        {board.description && <p className="max-w-prose">{board.description}</p>}
      </div>

      <TitledSection id="revisions" title="Revisions and sensor hardware" className="space-y-4">
        {board.revisions.length > 0 ? (
          board.revisions.map((revision) => <RevisionHardware key={revision.id} revision={revision} />)
        ) : (
          <p className="sb-unknown">No revision of this board is on record yet.</p>
        )}
      </TitledSection>
    </div>
  );
}
