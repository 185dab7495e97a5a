"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import type { Selection } from "@/components/values/selection";
import { apiFetch } from "@/lib/client/api-fetch";
import type { BoardValues } from "@/lib/published/board-values-types";

// One group's published values with their points, through the public API, so a switch of revision
// or family needs no page load. The query key names the view, so react-query keeps each one, a
// switch back is instant, and the board page and the contribution form's preview share the cache.

const valuesQueryKey = (slug: string, s: Selection) => ["board-values", slug, s.revision, s.family] as const;

function fetchGroupValues(slug: string, s: Selection, signal?: AbortSignal): Promise<BoardValues> {
  const query = new URLSearchParams({ revision: s.revision, family: s.family, points: "1" });
  return apiFetch<BoardValues>(`/api/v1/boards/${encodeURIComponent(slug)}/values?${query}`, {
    signal,
    unreachableMessage: "The values could not be loaded: no connection to Shuntbook. Check your connection and try again.",
    fallbackMessage: (status) => `The values could not be loaded (HTTP ${status}).`,
  });
}

/**
 * The values of one revision and family of a board. `initial` is the server-rendered first view;
 * `keepPrevious` keeps the last view on screen while the next loads.
 */
export function useBoardValues(slug: string, selection: Selection, options: { initial?: BoardValues; keepPrevious?: boolean; enabled?: boolean } = {}) {
  return useQuery({
    queryKey: valuesQueryKey(slug, selection),
    queryFn: ({ signal }) => fetchGroupValues(slug, selection, signal),
    initialData: options.initial,
    placeholderData: options.keepPrevious ? keepPreviousData : undefined,
    enabled: options.enabled ?? true,
  });
}
