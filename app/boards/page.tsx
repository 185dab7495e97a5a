import type { Metadata } from "next";
import Link from "next/link";
import { CatalogueFilters } from "@/components/catalogue-filters";
import { CatalogueTable } from "@/components/catalogue-table";
import { Pagination } from "@/components/pagination";
import { ParamErrors } from "@/components/param-errors";
import { formatMounting } from "@/lib/catalogue/format";
import { kindLabel } from "@/lib/catalogue/kinds";
import { listBoards } from "@/lib/catalogue/list-boards";
import { listMountingPatterns } from "@/lib/catalogue/mounting-patterns";
import { catalogueQueryString, parseCatalogueParams, type CatalogueParams } from "@/lib/catalogue/search-params";
import { TitledSection } from "@/components/titled-section";

export const dynamic = "force-dynamic";

type SearchParams = Record<string, string | string[] | undefined>;

export async function generateMetadata({ searchParams }: { searchParams: Promise<SearchParams> }): Promise<Metadata> {
  const parsed = parseCatalogueParams(await searchParams);
  if (!parsed.ok) return { title: "Boards — check the address", robots: { index: false } };
  return { title: parsed.params.q ? `Boards matching “${parsed.params.q}”` : "Boards" };
}

/** The raw query string with one parameter dropped, for the "remove this parameter" links. */
function withoutParam(raw: SearchParams, field: string): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(raw)) {
    if (key === field || value === undefined) continue;
    for (const v of Array.isArray(value) ? value : [value]) search.append(key, v);
  }
  const s = search.toString();
  return `/boards${s ? `?${s}` : ""}`;
}

export default async function BoardsPage({ searchParams }: { searchParams: Promise<SearchParams> }) {
  const raw = await searchParams;
  const parsed = parseCatalogueParams(raw);

  if (!parsed.ok) {
    return (
      <div className="space-y-6">
        <h1 className="font-display text-title uppercase">Boards</h1>
        <ParamErrors fieldErrors={parsed.fieldErrors} withoutField={(field) => withoutParam(raw, field)} />
      </div>
    );
  }

  const params = parsed.params;
  const [result, mountingPatterns] = await Promise.all([listBoards(params), listMountingPatterns()]);
  const hrefFor = (page: number) => `/boards${catalogueQueryString({ ...params, page })}`;
  const first = (result.page - 1) * result.pageSize + 1;
  const last = Math.min(result.total, result.page * result.pageSize);

  return (
    <div className="space-y-6">
      <h1 className="font-display text-title uppercase">Boards</h1>
      <CatalogueFilters params={params} mountingPatterns={mountingPatterns} />
      <ActiveFilters params={params} />

      <TitledSection id="results" title="Results" titleClassName="sr-only">
        <p className="mb-3 font-semibold" aria-live="polite">
          {result.total === 0
            ? "No boards match."
            : result.rows.length === 0
              ? `Page ${result.page} is past the end of the list.`
              : `Showing ${first}–${last} of ${result.total} ${result.total === 1 ? "board" : "boards"}`}
        </p>

        {result.rows.length > 0 ? (
          <CatalogueTable rows={result.rows} caption={describe(params, result.total)} />
        ) : result.total > 0 ? (
          <p>
            The list has {result.pageCount} {result.pageCount === 1 ? "page" : "pages"}.{" "}
            <Link href={hrefFor(result.pageCount)} className="font-semibold">
              Go to the last page
            </Link>
          </p>
        ) : (
          <div className="rounded-md border-2 border-rule-soft bg-surface p-4">
            <p>Try fewer words, the maker&rsquo;s name alone, or clear the filters.</p>
            <p className="mt-2">
              <Link href="/boards" className="font-semibold">
                Show all boards
              </Link>
            </p>
          </div>
        )}

        <Pagination page={result.page} pageCount={result.pageCount} hrefFor={hrefFor} />
      </TitledSection>
    </div>
  );
}

function describe(params: CatalogueParams, total: number): string {
  const parts = [`${total} boards`];
  if (params.q) parts.push(`matching “${params.q}”`);
  if (params.kind) parts.push(`of kind ${kindLabel(params.kind)}`);
  if (params.mounting) parts.push(`with ${params.mounting} mm mounting`);
  return parts.join(" ");
}

/** The filters in force, each with a link that drops just that one. */
function ActiveFilters({ params }: { params: CatalogueParams }) {
  const chips: { label: string; href: string }[] = [];
  if (params.q)
    chips.push({
      label: `“${params.q}”`,
      href: `/boards${catalogueQueryString({ ...params, q: undefined, page: 1, sort: params.sort === "relevance" ? "name" : params.sort })}`,
    });
  if (params.kind) chips.push({ label: kindLabel(params.kind), href: `/boards${catalogueQueryString({ ...params, kind: undefined, page: 1 })}` });
  if (params.mounting)
    chips.push({ label: `${formatMounting(params.mounting)} mm`, href: `/boards${catalogueQueryString({ ...params, mounting: undefined, page: 1 })}` });
  if (chips.length === 0) return null;
  return (
    <ul aria-label="Filters in use" className="flex flex-wrap gap-2">
      {chips.map((chip) => (
        <li key={chip.label}>
          <Link
            href={chip.href}
            className="inline-flex min-h-11 items-center gap-2 rounded-full border-2 border-rule bg-surface px-4 font-semibold text-ink no-underline hover:bg-sunken hover:text-ink"
          >
            {chip.label}
            <span aria-hidden="true" className="font-mono">
              ×
            </span>
            <span className="sr-only">(remove this filter)</span>
          </Link>
        </li>
      ))}
    </ul>
  );
}
