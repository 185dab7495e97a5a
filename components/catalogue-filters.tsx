import Link from "next/link";
import { formatMounting } from "@/lib/catalogue/format";
import { BOARD_KINDS, KIND_LABELS } from "@/lib/vocabulary";
import { CATALOGUE_SORTS, DEFAULT_PAGE_SIZE, QUERY_MAX_LENGTH, SORT_LABELS, type CatalogueParams } from "@/lib/catalogue/search-params";

/**
 * Search, filter and sort for /boards as one GET form: the URL holds the whole state, the back
 * button works, and it needs no JavaScript (so it stays a plain HTML form, not a react-hook-form
 * one). Submitting starts again at page 1 (no page field).
 */
export function CatalogueFilters({ params, mountingPatterns }: { params: CatalogueParams; mountingPatterns: string[] }) {
  // keep a hand-typed pattern selectable even when no board uses it yet
  const mountings = params.mounting && !mountingPatterns.includes(params.mounting) ? [...mountingPatterns, params.mounting] : mountingPatterns;
  return (
    <form action="/boards" method="get" role="search" aria-label="Filter boards" className="rounded-md border-3 border-rule bg-surface p-4">
      <div className="grid grid-cols-2 gap-3 md:grid-cols-[2fr_1.3fr_1fr_1.2fr_auto] md:items-end">
        <div className="col-span-2 md:col-span-1">
          <label htmlFor="f-q" className="mb-1 block font-semibold">
            Search
          </label>
          <input
            id="f-q"
            name="q"
            type="search"
            defaultValue={params.q ?? ""}
            maxLength={QUERY_MAX_LENGTH}
            autoComplete="off"
            spellCheck={false}
            enterKeyHint="search"
            placeholder="Name, nickname or maker"
            className="sb-field"
          />
        </div>
        <div>
          <label htmlFor="f-kind" className="mb-1 block font-semibold">
            Kind
          </label>
          <select id="f-kind" name="kind" defaultValue={params.kind ?? ""} className="sb-field">
            <option value="">All kinds</option>
            {BOARD_KINDS.map((k) => (
              <option key={k} value={k}>
                {KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="f-mounting" className="mb-1 block font-semibold">
            Mounting <span className="font-normal text-muted">(mm)</span>
          </label>
          <select id="f-mounting" name="mounting" defaultValue={params.mounting ?? ""} className="sb-field">
            <option value="">Any</option>
            {mountings.map((m) => (
              <option key={m} value={m}>
                {formatMounting(m)}
              </option>
            ))}
          </select>
        </div>
        <div className="col-span-2 md:col-span-1">
          <label htmlFor="f-sort" className="mb-1 block font-semibold">
            Sort by
          </label>
          <select id="f-sort" name="sort" defaultValue={params.sort} className="sb-field">
            {CATALOGUE_SORTS.map((s) => (
              <option key={s} value={s}>
                {SORT_LABELS[s]}
                {s === "relevance" ? " (when searching)" : ""}
              </option>
            ))}
          </select>
        </div>
        {params.pageSize !== DEFAULT_PAGE_SIZE && <input type="hidden" name="pageSize" value={params.pageSize} />}
        <div className="col-span-2 flex gap-3 md:col-span-1">
          <button type="submit" className="sb-button flex-1 md:flex-none">
            Show boards
          </button>
          <Link href="/boards" className="sb-button sb-button-quiet">
            Clear
          </Link>
        </div>
      </div>
    </form>
  );
}
