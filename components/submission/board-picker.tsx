"use client";

import { useEffect, useId, useState } from "react";
import { useBoardSearch, useChooseBoard } from "@/components/hooks/use-boards";
import { formatCells } from "@/lib/catalogue/format";
import type { ChosenBoard } from "./draft";
import { ErrorText } from "./field";

// Finding the board: the catalogue's own search, then the chosen board's revisions, both through
// the hooks in components/hooks/use-boards.ts. (No import from lib/catalogue/search-params here:
// it pulls the models, and so Sequelize, into the browser; the API names a too-long search in its
// own error.)

export function BoardPicker({ board, onChoose, error }: { board: ChosenBoard | null; onChoose: (board: ChosenBoard | null) => void; error?: string }) {
  const inputId = useId();
  const [text, setText] = useState("");
  const [q, setQ] = useState("");
  const chooser = useChooseBoard(onChoose);
  const choosing = chooser.isPending ? chooser.variables : null;
  const loadError = chooser.error?.message ?? null;

  // search as the person types, a quarter second after the last key
  useEffect(() => {
    const t = setTimeout(() => setQ(text.trim()), 250);
    return () => clearTimeout(t);
  }, [text]);

  const results = useBoardSearch(q, q.length >= 2 && board === null);
  const choose = (slug: string) => chooser.mutate(slug);

  if (board) {
    return (
      <div className="flex flex-wrap items-center justify-between gap-3 rounded-md border-2 border-rule bg-surface px-4 py-3">
        <p>
          <span className="block text-small text-muted">Board</span>
          <strong className="text-lead">{board.name}</strong> <span className="text-muted">· {formatCells(board.minCells, board.maxCells)}</span>
        </p>
        <button type="button" className="sb-button sb-button-quiet" onClick={() => onChoose(null)}>
          Change board
        </button>
      </div>
    );
  }

  const boards = results.data?.boards ?? [];
  return (
    <div>
      <label htmlFor={inputId} className="mb-1 block font-semibold">
        Board
      </label>
      <input
        id={inputId}
        type="search"
        value={text}
        onChange={(e) => setText(e.target.value)}
        autoComplete="off"
        spellCheck={false}
        placeholder="Name, nickname or maker"
        aria-describedby={`${inputId}-hint f-boardRevisionId-error`}
        aria-invalid={error ? true : undefined}
        className={`sb-field ${error ? "border-fault" : ""}`}
      />
      <p id={`${inputId}-hint`} className="mt-1 text-small text-muted">
        Type two letters or more; close spellings and forum nicknames match too.
      </p>
      <ErrorText id="f-boardRevisionId-error" message={error} />
      <div aria-live="polite" className="mt-2">
        {results.isFetching && <p className="text-small text-muted">Searching…</p>}
        {results.error && <p className="text-fault">{(results.error as Error).message}</p>}
        {loadError && <p className="text-fault">{loadError}</p>}
        {q.length >= 2 && results.isSuccess && boards.length === 0 && <p>No board matches &ldquo;{q}&rdquo;.</p>}
      </div>
      {boards.length > 0 && (
        <ul className="mt-1 divide-y divide-rule-soft rounded-md border-2 border-rule bg-surface" aria-label="Matching boards">
          {boards.map((b) => (
            <li key={b.slug}>
              <button
                type="button"
                onClick={() => choose(b.slug)}
                disabled={choosing !== null}
                className="flex min-h-12 w-full flex-wrap items-baseline justify-between gap-x-3 px-4 py-2 text-left hover:bg-sunken"
              >
                <span>
                  <strong>{b.name}</strong> <span className="text-muted">by {b.manufacturer.name}</span>
                </span>
                <span className="text-small text-muted">
                  {formatCells(b.minCells, b.maxCells)}
                  {choosing === b.slug ? " · loading…" : ""}
                </span>
              </button>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
