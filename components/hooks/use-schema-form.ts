"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, type DefaultValues, type FieldErrors, type FieldValues, type Path, type Resolver, type UseFormSetError } from "react-hook-form";
import type { z } from "zod";
import { ApiFetchError } from "@/lib/client/api-fetch";

// The one way a form that sends data is built: react-hook-form holds the fields, the server's own
// zod schema checks the body made from them (so a refusal reads the same before and after the round
// trip), and the server's field errors land on the same fields through setError.

/** Messages by field path ("readings.0.cells"); a message about the whole form is under "input". */
export type Errors = Record<string, string[]>;

type ErrorNode = { message?: unknown; types?: Record<string, unknown> };

function messagesOf(node: ErrorNode): string[] {
  const all = node.types ? Object.values(node.types).flat() : [node.message];
  return all.filter((m): m is string => typeof m === "string" && m !== "");
}

/** react-hook-form's nested errors as flat paths, every message of each (the form keeps them all). */
export function flatErrors(errors: FieldErrors, prefix = ""): Errors {
  const out: Errors = {};
  for (const [key, value] of Object.entries(errors ?? {})) {
    if (!value || typeof value !== "object" || key === "ref" || key === "types") continue;
    if (key === "root" && prefix === "") {
      for (const node of Object.values(value as Record<string, ErrorNode>)) if (node && typeof node === "object") (out.input ??= []).push(...messagesOf(node));
      const own = messagesOf(value as ErrorNode);
      if (own.length) (out.input ??= []).push(...own);
      continue;
    }
    const path = prefix ? `${prefix}.${key}` : key;
    const messages = messagesOf(value as ErrorNode);
    if (messages.length) out[path] = messages;
    Object.assign(out, flatErrors(value as FieldErrors, path));
  }
  return out;
}

/** A refused request's messages: by field when the server named fields, else under "input". */
export function errorsOf(error: unknown): Errors {
  if (!error) return {};
  if (!(error instanceof ApiFetchError)) return { input: [String(error)] };
  const fields = Object.entries(error.fieldErrors).filter(([, messages]) => messages.length > 0);
  return fields.length ? Object.fromEntries(fields) : { input: [error.message] };
}

/** Puts a refused request's messages on the form's fields (paths as the server names them). */
export function showServerErrors<V extends FieldValues>(setError: UseFormSetError<V>, error: unknown): void {
  for (const [path, messages] of Object.entries(errorsOf(error))) {
    const name = (path === "input" ? "root.server" : path) as Path<V> | "root.server";
    setError(name, { type: "server", message: messages.join(" ") });
  }
}

/**
 * A form checked with a shared zod schema over the body `toBody` makes of its fields. With `raw`
 * the body is sent as built; without, as the schema parsed it. Errors stay until the next submit.
 */
export function useSchemaForm<V extends FieldValues>(
  schema: z.ZodType,
  options: { defaultValues: DefaultValues<V>; toBody: (values: V) => unknown; raw?: boolean },
) {
  const { toBody, raw = false } = options;
  const resolver: Resolver<V> = async (values, context, resolverOptions) => {
    const check = (raw ? zodResolver(schema as never, undefined, { raw: true }) : zodResolver(schema as never)) as unknown as Resolver<Record<string, unknown>>;
    return (await check(toBody(values) as Record<string, unknown>, context, resolverOptions as never)) as unknown as Awaited<ReturnType<Resolver<V>>>;
  };
  const form = useForm<V>({ defaultValues: options.defaultValues, resolver, criteriaMode: "all", reValidateMode: "onSubmit", shouldFocusError: false });
  return { form, errors: flatErrors(form.formState.errors) };
}
