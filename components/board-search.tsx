import { QUERY_MAX_LENGTH } from "@/lib/catalogue/search-params";

/**
 * The big "find a board" box: a plain GET form to /boards, so it works before (and without)
 * JavaScript and the result URL can be shared. That is why it stays a plain HTML form rather
 * than a react-hook-form one.
 */
export function BoardSearch({ id = "board-search", defaultValue }: { id?: string; defaultValue?: string }) {
  return (
    <form action="/boards" method="get" role="search" className="w-full">
      <label htmlFor={id} className="mb-2 block font-display text-xl font-bold tracking-wide uppercase">
        Find your board
      </label>
      <div className="flex flex-col gap-3 sm:flex-row">
        <input
          id={id}
          name="q"
          type="search"
          defaultValue={defaultValue}
          maxLength={QUERY_MAX_LENGTH}
          autoComplete="off"
          spellCheck={false}
          enterKeyHint="search"
          placeholder="Name, nickname or maker"
          aria-describedby={`${id}-hint`}
          className="sb-field min-h-14 border-3 text-lead"
        />
        <button type="submit" className="sb-button min-h-14 px-8 text-lead">
          Search
        </button>
      </div>
      <p id={`${id}-hint`} className="mt-2 text-small text-muted">
        Close spellings match too, and so do the names people use on forums.
      </p>
    </form>
  );
}
