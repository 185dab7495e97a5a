"use client";

import { useState } from "react";
import type { UseFormRegisterReturn } from "react-hook-form";
import { BoardPicker } from "@/components/submission/board-picker";
import type { ChosenBoard } from "@/lib/submissions/form-data";

// The quad's board, found with the contribution form's searchable picker (name, nickname or maker),
// then its revision. A board with one revision has it chosen at once; with several, the builder
// picks the one printed on the board. "Change board" clears the revision with it.

export function BoardRevisionField({
  id,
  initialBoard,
  register,
  setRevision,
  error,
}: {
  id: string;
  initialBoard: ChosenBoard | null;
  register: UseFormRegisterReturn;
  setRevision: (value: string) => void;
  error?: string;
}) {
  const [board, setBoard] = useState<ChosenBoard | null>(initialBoard);
  const choose = (next: ChosenBoard | null) => {
    setBoard(next);
    setRevision(next && next.revisions.length === 1 ? String(next.revisions[0].id) : "");
  };
  return (
    <div className="space-y-2">
      <BoardPicker board={board} onChoose={choose} error={board ? undefined : error} />
      {board ? (
        <div>
          <label htmlFor={id} className="mb-1 block font-semibold">
            Revision
          </label>
          <select id={id} {...register} className="sb-field" aria-invalid={error ? true : undefined} aria-describedby={`${id}-hint`}>
            {board.revisions.length !== 1 && <option value="">Choose the revision printed on the board</option>}
            {board.revisions.map((r) => (
              <option key={r.id} value={String(r.id)}>
                {r.label}
              </option>
            ))}
          </select>
          <p id={`${id}-hint`} className="mt-1 text-small text-muted">
            Revisions can have different sensors. The board&rsquo;s published values for it are a worksheet&rsquo;s starting point.
          </p>
          {error && (
            <p className="mt-1 font-semibold text-fault">
              <span aria-hidden="true">⚠ </span>
              {error}
            </p>
          )}
        </div>
      ) : (
        <input type="hidden" {...register} />
      )}
    </div>
  );
}
