// The browser's one way to call Shuntbook's JSON API. Every client read and write goes through
// apiFetch (react-query hooks wrap it), so the one error shape of the API is parsed in one place:
// a refusal becomes an ApiFetchError carrying the status, the message and the field errors that
// forms show beside their fields.

export type FieldErrors = Record<string, string[]>;

export class ApiFetchError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fieldErrors: FieldErrors = {},
  ) {
    super(message);
    this.name = "ApiFetchError";
  }
}

/** Said when the request never reached the server (offline, DNS, a dropped connection). */
export const UNREACHABLE_MESSAGE = "The server could not be reached. Check the connection and try again.";

type ErrorBody = { error?: { message?: unknown; fieldErrors?: unknown } };

function fieldErrorsFrom(value: unknown): FieldErrors {
  if (!value || typeof value !== "object") return {};
  const out: FieldErrors = {};
  for (const [field, messages] of Object.entries(value)) {
    if (Array.isArray(messages)) out[field] = messages.filter((m): m is string => typeof m === "string");
  }
  return out;
}

/** What a refusal without the API's error body says, by status. */
export type FallbackMessage = (status: number) => string;

const defaultFallback: FallbackMessage = (status) => `The server answered ${status}. Try again in a moment.`;

/**
 * The ApiFetchError for a non-2xx answer whose body is already parsed (or null): the one reading of
 * the error shape, shared with the photo upload, which gets its body from XMLHttpRequest.
 */
export function errorFromBody(status: number, body: unknown, fallback: FallbackMessage = defaultFallback): ApiFetchError {
  const error = (body as ErrorBody | null)?.error;
  const message = typeof error?.message === "string" ? error.message : fallback(status);
  return new ApiFetchError(status, message, fieldErrorsFrom(error?.fieldErrors));
}

/** The ApiFetchError for a non-2xx answer, from the API's error body when there is one. */
export async function errorFromResponse(response: Response, fallback?: FallbackMessage): Promise<ApiFetchError> {
  return errorFromBody(response.status, await response.json().catch(() => null), fallback);
}

export type ApiFetchOptions = {
  method?: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  /** Sent as JSON with Content-Type: application/json. */
  json?: unknown;
  headers?: Record<string, string>;
  signal?: AbortSignal;
  /** Said instead of UNREACHABLE_MESSAGE when the server cannot be reached, in the caller's words. */
  unreachableMessage?: string;
  /** Said for a refusal that carries no message of the API's own (a proxy's HTML page, say). */
  fallbackMessage?: FallbackMessage;
};

/**
 * Calls the API and returns the parsed JSON body typed as T (undefined for 204). Throws
 * ApiFetchError for a refusal (with its field errors) and for an unreachable server (status 0).
 */
export async function apiFetch<T>(path: string, options: ApiFetchOptions = {}): Promise<T> {
  const headers: Record<string, string> = { accept: "application/json", ...options.headers };
  if (options.json !== undefined) headers["content-type"] = "application/json";
  let response: Response;
  try {
    response = await fetch(path, {
      method: options.method ?? (options.json === undefined ? "GET" : "POST"),
      headers,
      body: options.json === undefined ? undefined : JSON.stringify(options.json),
      signal: options.signal,
      cache: "no-store",
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === "AbortError") throw error;
    throw new ApiFetchError(0, options.unreachableMessage ?? UNREACHABLE_MESSAGE);
  }
  if (!response.ok) throw await errorFromResponse(response, options.fallbackMessage);
  if (response.status === 204) return undefined as T;
  return (await response.json()) as T;
}
