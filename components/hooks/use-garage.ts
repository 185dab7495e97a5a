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

/** Sends one garage form's body to its endpoint: POST to add (a quad, a pack, a charge), PUT to correct one. */
export function useGarageSave(endpoint: string, method: "POST" | "PUT" = "POST") {
  return useMutation({
    mutationFn: (body: unknown) => apiFetch<unknown>(endpoint, { method, json: body, unreachableMessage: NO_ANSWER, fallbackMessage: () => NO_ANSWER }),
  });
}

/** DELETEs one garage row; answers whether the server archived it instead (a published worksheet used it). */
export function useGarageDelete(endpoint: string) {
  return useMutation({
    mutationFn: async () => {
      const body = await apiFetch<{ archived?: boolean } | undefined>(endpoint, {
        method: "DELETE",
        unreachableMessage: NO_ANSWER,
        fallbackMessage: () => NO_ANSWER,
      });
      return { archived: body?.archived === true };
    },
  });
}
