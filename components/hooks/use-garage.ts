"use client";

import { useMutation, useQuery } from "@tanstack/react-query";
import type { PackView } from "@/lib/garage/packs";
import { ApiFetchError, apiFetch } from "@/lib/client/api-fetch";

// The garage on the client: the builder's packs (for the worksheet's pack choice) and the one write
// each small garage form makes. Saved rows appear by refreshing the server page, so the write
// keeps nothing in the cache.

export type PackChoice = Pick<PackView, "id" | "label" | "chemistry" | "cells" | "ratedMah">;

const packsKey = ["garage-packs"] as const;

/** The builder's packs; a failure says to type the figures instead. */
export function usePacks() {
  return useQuery({
    queryKey: packsKey,
    queryFn: async ({ signal }) => {
      try {
        return (await apiFetch<{ packs: PackChoice[] }>("/api/v1/garage/packs", { signal })).packs;
      } catch (error) {
        if (!(error instanceof ApiFetchError)) throw error;
        throw new Error(
          error.status === 0
            ? "Your packs did not load: the server could not be reached; type the figures instead."
            : `Your packs did not load (HTTP ${error.status}); type the figures instead.`,
        );
      }
    },
  });
}

const NO_ANSWER = "The server did not answer; try again.";

/** POSTs one garage form's body to its endpoint (a quad, a pack, a charge). */
export function useGarageSave(endpoint: string) {
  return useMutation({
    mutationFn: (body: unknown) => apiFetch<unknown>(endpoint, { json: body, unreachableMessage: NO_ANSWER, fallbackMessage: () => NO_ANSWER }),
  });
}
