import { afterEach, describe, expect, it, vi } from "vitest";
import { ApiFetchError, apiFetch, errorFromBody, UNREACHABLE_MESSAGE } from "@/lib/client/api-fetch";

// apiFetch reads Shuntbook's own error body ({ error: { message, fieldErrors } }, our API's shape),
// and says a caller's own words when the server is unreachable or answers without that body.
const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });

afterEach(() => vi.unstubAllGlobals());

async function refusal(promise: Promise<unknown>): Promise<ApiFetchError> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(ApiFetchError);
  return error as ApiFetchError;
}

describe("apiFetch", () => {
  it("sends JSON as a POST and returns the parsed answer", async () => {
    const fetch = vi.fn(async () => json(201, { worksheet: { id: 7 } }));
    vi.stubGlobal("fetch", fetch);
    expect(await apiFetch<{ worksheet: { id: number } }>("/api/v1/x", { json: { a: 1 } })).toEqual({ worksheet: { id: 7 } });
    const [, init] = fetch.mock.calls[0] as unknown as [string, RequestInit];
    expect(init.method).toBe("POST");
    expect(init.body).toBe('{"a":1}');
    expect((init.headers as Record<string, string>)["content-type"]).toBe("application/json");
  });

  it("returns undefined for 204", async () => {
    vi.stubGlobal(
      "fetch",
      vi.fn(async () => new Response(null, { status: 204 })),
    );
    expect(await apiFetch("/api/v1/x", { method: "DELETE" })).toBeUndefined();
  });

  it("turns the API's error body into status, message and field errors", async () => {
    vi.stubGlobal(
      "fetch",
      vi.fn(async () => json(400, { error: { message: "Check the fields", fieldErrors: { cells: ["Enter the cells"], bad: "not a list" } } })),
    );
    const error = await refusal(apiFetch("/api/v1/x", { json: {} }));
    expect(error.status).toBe(400);
    expect(error.message).toBe("Check the fields");
    expect(error.fieldErrors).toEqual({ cells: ["Enter the cells"] });
  });

  it("says the caller's fallback for a refusal without the API's body, and its own words when unreachable", async () => {
    vi.stubGlobal(
      "fetch",
      vi.fn(async () => new Response("<html>bad gateway</html>", { status: 502 })),
    );
    expect((await refusal(apiFetch("/x", { fallbackMessage: (s) => `No luck (HTTP ${s}).` }))).message).toBe("No luck (HTTP 502).");
    expect((await refusal(apiFetch("/x"))).message).toBe("The server answered 502. Try again in a moment.");

    vi.stubGlobal(
      "fetch",
      vi.fn(async () => Promise.reject(new TypeError("Failed to fetch"))),
    );
    const unreachable = await refusal(apiFetch("/x"));
    expect(unreachable.status).toBe(0);
    expect(unreachable.message).toBe(UNREACHABLE_MESSAGE);
    expect((await refusal(apiFetch("/x", { unreachableMessage: "Nothing was saved." }))).message).toBe("Nothing was saved.");
  });
});

describe("errorFromBody (the photo upload's XMLHttpRequest answers)", () => {
  it("reads an already parsed body the same way", () => {
    const error = errorFromBody(413, { error: { message: "Too big", fieldErrors: { photo: ["Over 8 MB"] } } });
    expect([error.status, error.message, error.fieldErrors]).toEqual([413, "Too big", { photo: ["Over 8 MB"] }]);
    expect(errorFromBody(500, null, (s) => `Failed (HTTP ${s}).`).message).toBe("Failed (HTTP 500).");
  });
});
