"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, type DefaultValues, type FieldValues, type Resolver } from "react-hook-form";

/**
 * What every account form shares: react-hook-form checked by the server's zod schema as each field
 * is left, a message for the whole form, and a submit that clears that message before it sends and
 * hands a refusal to the form (each form words its refusals its own way).
 */
export function useAccountForm<V extends FieldValues>(schema: Parameters<typeof zodResolver>[0], defaultValues?: DefaultValues<V>) {
  const form = useForm<V>({ resolver: zodResolver(schema) as unknown as Resolver<V>, mode: "onTouched", defaultValues });
  const [problem, setProblem] = useState<string | null>(null);
  const submit = (send: (values: V) => Promise<void>, refused: (error: unknown) => void) =>
    form.handleSubmit(async (values) => {
      setProblem(null);
      try {
        await send(values);
      } catch (error) {
        refused(error);
      }
    });
  return { ...form, fields: { register: form.register, errors: form.formState.errors }, problem, setProblem, submit };
}
