"use client";

import { useMutation, useQuery } from "@tanstack/react-query";
import type { ChosenBoard } from "@/lib/submissions/form-data";
import type { BoardDetailResponse, BoardListResponse } from "@/lib/catalogue/api-schemas";
import { apiFetch, type FallbackMessage } from "@/lib/client/api-fetch";

// The catalogue as the contribution form reads it: the board search (GET /api/v1/boards?q=, the
// same aliases and close spellings as the board list) and one board's revisions
// (GET /api/v1/boards/{slug}). The search is keyed by what was typed.

const catalogueFallback: FallbackMessage = (status) => `The catalogue did not answer (HTTP ${status}).`;

/** Boards matching what was typed, eight at most; runs only when `enabled`. */
export function useBoardSearch(q: string, enabled: boolean) {
  return useQuery({
    queryKey: ["submit-board-search", q],
    queryFn: ({ signal }) =>
      apiFetch<BoardListResponse>(`/api/v1/boards?${new URLSearchParams({ q, pageSize: "8" })}`, { signal, fallbackMessage: catalogueFallback }),
    enabled,
  });
}

async function fetchChosenBoard(slug: string): Promise<ChosenBoard> {
  const b = await apiFetch<BoardDetailResponse>(`/api/v1/boards/${encodeURIComponent(slug)}`, { fallbackMessage: catalogueFallback });
  return { slug: b.slug, name: b.name, minCells: b.minCells, maxCells: b.maxCells, revisions: b.revisions.map((r) => ({ id: r.id, label: r.label })) };
}

/** Loads a board chosen from the search, with its revisions; `onChosen` gets it. */
export function useChooseBoard(onChosen: (board: ChosenBoard) => void) {
  return useMutation({ mutationFn: fetchChosenBoard, onSuccess: onChosen });
}
