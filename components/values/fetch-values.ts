import type { BoardValues } from "@/lib/published/board-values-types";
import type { Selection } from "./selection";

// The browser's read of one group's values with its points, through the public API, so a switch
// of revision or family needs no page load. The query key names the view, so react-query keeps
// each one and a switch back is instant.

export const valuesQueryKey = (slug: string, s: Selection) => ["board-values", slug, s.revision, s.family] as const;

export class ValuesLoadError extends Error {}

export async function fetchGroupValues(slug: string, s: Selection, signal?: AbortSignal): Promise<BoardValues> {
  const query = new URLSearchParams({ revision: s.revision, family: s.family, points: "1" });
  let response: Response;
  try {
    response = await fetch(`/api/v1/boards/${encodeURIComponent(slug)}/values?${query}`, { signal, headers: { accept: "application/json" } });
  } catch (error) {
    if (signal?.aborted) throw error;
    throw new ValuesLoadError("The values could not be loaded: no connection to Shuntbook. Check your connection and try again.");
  }
  if (!response.ok) {
    // the API's one error body: { error: { message } }
    const body = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
    throw new ValuesLoadError(body?.error?.message ?? `The values could not be loaded (HTTP ${response.status}).`);
  }
  return (await response.json()) as BoardValues;
}
