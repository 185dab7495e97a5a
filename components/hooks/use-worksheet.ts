"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { apiFetch, type ApiFetchOptions } from "@/lib/client/api-fetch";

// A garage worksheet on the client: read as a query keyed by its id (refetched when the tab comes
// back into view, so a reading saved on another phone shows up), and each write a mutation whose
// answer replaces the cached worksheet, so the page always shows what the server stored.

const NOT_SAVED = "The server did not answer, so nothing was saved. Check the connection and try again.";
const saving: Pick<ApiFetchOptions, "unreachableMessage" | "fallbackMessage"> = { unreachableMessage: NOT_SAVED, fallbackMessage: () => NOT_SAVED };

const worksheetKey = (id: number) => ["garage-worksheet", id] as const;
const worksheetPath = (id: number) => `/api/v1/garage/worksheets/${id}`;

type WorksheetAnswer<V> = { worksheet: V };

export function useSavedWorksheet<V extends { id: number }>(initial: V) {
  const queryClient = useQueryClient();
  const router = useRouter();
  const base = worksheetPath(initial.id);
  const key = worksheetKey(initial.id);
  const query = useQuery({
    queryKey: key,
    queryFn: async ({ signal }) => (await apiFetch<WorksheetAnswer<V>>(base, { signal, ...saving })).worksheet,
    initialData: initial,
    refetchOnWindowFocus: true,
  });
  const store = ({ worksheet }: WorksheetAnswer<V>) => queryClient.setQueryData(key, worksheet);
  const add = useMutation({ mutationFn: (body: unknown) => apiFetch<WorksheetAnswer<V>>(`${base}/steps`, { json: body, ...saving }), onSuccess: store });
  const remove = useMutation({
    mutationFn: (position: number) => apiFetch<WorksheetAnswer<V>>(`${base}/steps/${position}`, { method: "DELETE", ...saving }),
    onSuccess: store,
  });
  const publish = useMutation({
    mutationFn: () => apiFetch<{ submission: { id: number } }>(`${base}/publish`, { json: {}, ...saving }),
    onSuccess: ({ submission }) => router.push(`/my/submissions?sent=${submission.id}`),
  });
  return { sheet: query.data ?? initial, add, remove, publish, busy: add.isPending || remove.isPending || publish.isPending };
}

/** Starts a worksheet of a kind on a quad; the answer is the new worksheet. */
export function useStartWorksheet<V>(onStarted: (sheet: V) => void, messages: Pick<ApiFetchOptions, "unreachableMessage" | "fallbackMessage"> = saving) {
  return useMutation({
    mutationFn: (body: unknown) => apiFetch<WorksheetAnswer<V>>("/api/v1/garage/worksheets", { json: body, ...messages }),
    onSuccess: ({ worksheet }) => onStarted(worksheet),
  });
}
