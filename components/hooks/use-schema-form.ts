"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, type DefaultValues, type FieldValues, type Resolver } from "react-hook-form";
import type { z } from "zod";
import { flatErrors } from "@/components/form-errors";

// The one way a form that sends data is built: react-hook-form holds the fields, the server's own
// zod schema checks the body made from them (so a refusal reads the same before and after the round
// trip), and the server's field errors land on the same fields (components/form-errors.ts).

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
