"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useLayoutEffect, useMemo, useRef, useState, type ReactNode } from "react";
import { FormProvider, useForm, useWatch, type FieldErrors, type Resolver } from "react-hook-form";
import { useSendSubmission, type SendTarget } from "@/components/hooks/use-submission";
import { EvidencePhotos } from "@/components/photos/evidence-photos";
import { ApiFetchError } from "@/lib/client/api-fetch";
import { NOTES_MAX_LENGTH } from "@/lib/submissions/limits";
import { submissionSchema } from "@/lib/submissions/schema";
import { METHOD_HINTS, METHOD_LABELS, METHODS, SENSING_SOURCE_LABELS, SENSING_SOURCES } from "@/lib/vocabulary";
import { BoardPicker } from "./board-picker";
import { DistributionPreview } from "./distribution-preview";
import { emptyDraft, sectionsFor, toPayload, type ChosenBoard, type FamilyOption, type SubmissionDraft } from "./draft";
import { EvidencePreview } from "./evidence-preview";
import { BenchSection, CyclesSection, SettingField, VoltageCheckSection } from "./evidence-sections";
import { ErrorText, SelectField, TextField, errorAt, fieldId } from "./field";

// The contribution form. react-hook-form holds the draft; validation is lib/submissions/schema.ts
// (the same schema POST/PATCH /api/v1/submissions parse with), made for the chosen family and
// board, over the body toPayload builds. It sends through useSendSubmission, with an
// Idempotency-Key that lives as long as this draft, so a retry after a dropped connection can
// never create a second submission.

export type FormMode = { kind: "create" } | { kind: "edit"; id: number; version: number };

type Problem = { path: string; message: string };

/** Every message in react-hook-form's nested errors, with the path it belongs to. */
function flatten(errors: FieldErrors, prefix = ""): Problem[] {
  const out: Problem[] = [];
  for (const [key, value] of Object.entries(errors ?? {})) {
    if (!value || typeof value !== "object" || key === "ref") continue;
    const path = key === "root" ? prefix : prefix ? `${prefix}.${key}` : key;
    const message = (value as { message?: unknown }).message;
    if (typeof message === "string" && message) out.push({ path, message });
    out.push(...flatten(value as FieldErrors, path));
  }
  return out;
}

function newKey(): string {
  // randomUUID exists only in secure contexts (https, localhost); a phone on the LAN may lack it
  if (typeof crypto.randomUUID === "function") return crypto.randomUUID();
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return Array.from(bytes, (b) => b.toString(16).padStart(2, "0")).join("");
}

const DRAFT_KEYS = new Set(Object.keys(emptyDraft()));

function Step({ n, title, children }: { n: number; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={`step-${n}`} className="space-y-4">
      <h2 id={`step-${n}`} className="flex items-baseline gap-3 font-display text-heading uppercase">
        <span className="inline-flex size-9 shrink-0 items-center justify-center rounded-full bg-ink font-mono text-lg text-paper" aria-hidden="true">
          {n}
        </span>
        {title}
      </h2>
      {children}
    </section>
  );
}

export function SubmissionForm({
  families,
  mode,
  initialDraft,
  initialBoard = null,
}: {
  families: FamilyOption[];
  mode: FormMode;
  initialDraft?: SubmissionDraft;
  initialBoard?: ChosenBoard | null;
}) {
  const router = useRouter();
  const [board, setBoard] = useState<ChosenBoard | null>(initialBoard);
  const [idempotencyKey, setIdempotencyKey] = useState(newKey);
  // names the draft for the photo uploader; unlike the idempotency key it never changes
  const [draftKey] = useState(() => (mode.kind === "edit" ? `edit-${mode.id}` : newKey()));
  const [outcome, setOutcome] = useState<{ message: string; others: string[] } | null>(null);
  const summaryRef = useRef<HTMLDivElement>(null);

  const familyRef = useRef<FamilyOption | null>(null);
  const boardRef = useRef<ChosenBoard | null>(board);
  // the resolver reads the current family and board at each validation, so the limits follow the choices
  const resolver = useMemo<Resolver<SubmissionDraft>>(
    () => async (values, context, options) => {
      const schema = submissionSchema({ family: familyRef.current, board: boardRef.current });
      const result = await zodResolver(schema)(toPayload(values), context, options as never);
      return result as unknown as Awaited<ReturnType<Resolver<SubmissionDraft>>>;
    },
    [],
  );

  const form = useForm<SubmissionDraft>({ defaultValues: initialDraft ?? emptyDraft(), resolver, mode: "onTouched", shouldFocusError: false });
  const { handleSubmit, setError, setValue, getValues, register, control, formState } = form;
  const [familyId, method, includeVoltageCheck] = useWatch({ control, name: ["firmwareFamilyId", "method", "includeVoltageCheck"] });
  const family = families.find((f) => f.id === familyId) ?? null;
  // kept current after each commit, before any event can validate (chooseBoard also sets the board at once)
  useLayoutEffect(() => {
    familyRef.current = family;
    boardRef.current = board;
  });
  const shown = sectionsFor(method, includeVoltageCheck);

  function chooseBoard(next: ChosenBoard | null) {
    setBoard(next);
    boardRef.current = next;
    setValue("boardRevisionId", next && next.revisions.length === 1 ? next.revisions[0].id : null, { shouldValidate: formState.isSubmitted });
  }

  const showSummary = () => requestAnimationFrame(() => summaryRef.current?.focus());

  const sender = useSendSubmission();

  async function send() {
    setOutcome(null);
    const body = toPayload(getValues());
    const target: SendTarget = mode.kind === "create" ? { kind: "create", idempotencyKey } : mode;
    let sent: { submission: { id: number } };
    try {
      sent = await sender.mutateAsync({ target, body });
    } catch (e) {
      if (!(e instanceof ApiFetchError)) throw e;
      return refused(e);
    }
    router.push(`/my/submissions?${mode.kind === "create" ? "sent" : "updated"}=${sent?.submission?.id}`);
  }

  /** The server's refusal: its field errors on the fields, the rest and a summary at the top. */
  function refused(error: ApiFetchError) {
    const others: string[] = [];
    for (const [path, messages] of Object.entries(error.fieldErrors)) {
      if (DRAFT_KEYS.has(path.split(".")[0]) && path !== "photoIds") setError(path as never, { type: "server", message: messages[0] });
      else others.push(...messages);
    }
    let message = error.message;
    if (error.status === 400) message = "Some values need another look; each is marked below.";
    if (error.status === 401) message = "Your sign-in has ended. Sign in again in another tab, then send once more: nothing you typed is lost.";
    if (error.status === 422) {
      // this draft's key was used for other values: keep the work, make the next send a new one
      setIdempotencyKey(newKey());
      message = "This form was already sent once with other values. Check My submissions before sending again; sending now makes a new submission.";
    }
    setOutcome({ message, others });
    showSummary();
  }

  const problems = flatten(formState.errors);
  const familyOptions = families.map((f) => ({ value: f.id, label: f.name }));
  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={(event) => handleSubmit(send, showSummary)(event)} className="space-y-10" aria-describedby="form-intro">
        <div ref={summaryRef} tabIndex={-1} className="focus:outline-none" aria-live="assertive">
          {(outcome || (formState.isSubmitted && problems.length > 0)) && (
            <div id="form-problems" role="alert" className="rounded-md border-3 border-fault bg-fault-wash p-4">
              <h2 className="font-display text-heading text-fault uppercase">{outcome ? "Not sent yet" : "Some values need another look"}</h2>
              {outcome && <p className="mt-2">{outcome.message}</p>}
              {outcome?.others.map((m) => (
                <p key={m} className="mt-1 font-semibold">
                  {m}
                </p>
              ))}
              {problems.length > 0 && (
                <ul className="mt-2 list-disc space-y-1 pl-5">
                  {problems.map((p) => (
                    <li key={`${p.path}:${p.message}`}>
                      <a href={`#${fieldId(p.path || "body")}`}>{p.message}</a>
                    </li>
                  ))}
                </ul>
              )}
              {mode.kind === "edit" && outcome && /changed since you loaded it/.test(outcome.message) && (
                <p className="mt-2">
                  <a href={`/my/submissions/${mode.id}/edit`}>Reload the submission</a> to see the newer version.
                </p>
              )}
            </div>
          )}
        </div>

        <Step n={1} title="Board and firmware">
          <div className="space-y-4 rounded-md border-3 border-rule bg-surface p-4 sm:p-5">
            <BoardPicker board={board} onChoose={chooseBoard} error={board ? undefined : errorAt(formState.errors, "boardRevisionId")} />
            {board && (
              <SelectField
                name="boardRevisionId"
                label="Revision"
                placeholder="Choose the revision"
                asNumber
                hint="Printed on the board, or in its documentation. Revisions can have different sensors."
                options={board.revisions.map((r) => ({ value: r.id, label: r.label }))}
              />
            )}
            <div className="grid gap-4 sm:grid-cols-2">
              <SelectField
                name="firmwareFamilyId"
                label="Firmware family"
                placeholder="Choose the family"
                asNumber
                hint={family?.description ?? "Values are only comparable within one family: each stores its settings in its own units."}
                options={familyOptions}
              />
              <TextField name="firmwareVersion" label="Firmware version" placeholder="e.g. dunlin" hint="As the firmware reports it." />
            </div>
          </div>
        </Step>

        <Step n={2} title="How you checked">
          <div className="space-y-4 rounded-md border-3 border-rule bg-surface p-4 sm:p-5">
            <SelectField
              name="sensingSource"
              label="Where the readings come from"
              placeholder="Choose the source"
              options={SENSING_SOURCES.map((s) => ({ value: s, label: SENSING_SOURCE_LABELS[s] }))}
            />
            <fieldset id={fieldId("method")} aria-describedby={errorAt(formState.errors, "method") ? "f-method-error" : undefined}>
              <legend className="mb-2 font-semibold">Method</legend>
              <div className="grid gap-2 sm:grid-cols-2">
                {METHODS.map((m) => (
                  <label
                    key={m}
                    className="flex cursor-pointer gap-3 rounded-md border-2 border-rule-soft bg-paper p-3 has-[:checked]:border-copper has-[:checked]:bg-surface"
                  >
                    <input type="radio" value={m} className="mt-1 size-5 accent-[var(--sb-copper)]" {...register("method")} />
                    <span>
                      <strong className="block">{METHOD_LABELS[m]}</strong>
                      <span className="text-small text-muted">{METHOD_HINTS[m]}</span>
                    </span>
                  </label>
                ))}
              </div>
              <ErrorText id="f-method-error" message={errorAt(formState.errors, "method")} />
            </fieldset>
            {shown.voltageCheckOptional && (
              <label className="flex items-center gap-3">
                <input type="checkbox" className="size-5 accent-[var(--sb-copper)]" {...register("includeVoltageCheck")} />I also checked the pack voltage with
                a multimeter
              </label>
            )}
          </div>
        </Step>

        {(shown.voltageCheck || shown.cycles || shown.bench) && (
          <Step n={3} title="Your measurements">
            {shown.voltageCheck && <VoltageCheckSection family={family} />}
            {shown.cycles && <CyclesSection family={family} />}
            {shown.bench && <BenchSection family={family} />}
          </Step>
        )}

        <Step n={shown.voltageCheck || shown.cycles || shown.bench ? 4 : 3} title="The values you now use">
          <div className="space-y-4 rounded-md border-3 border-rule bg-surface p-4 sm:p-5">
            <p className="max-w-prose">Enter the settings as the firmware stores them. Leave out any you did not calibrate, but give at least one.</p>
            <div className="grid gap-4 md:grid-cols-3">
              <SettingField name="voltageScale" label="Voltage scale" family={family} setting="voltage" />
              <SettingField name="currentScale" label="Current scale" family={family} setting="current" />
              <SettingField name="currentOffset" label="Current offset" family={family} setting="offset" />
            </div>
            <EvidencePreview family={family} />
            <DistributionPreview board={board} families={families} />
          </div>
        </Step>

        <Step n={shown.voltageCheck || shown.cycles || shown.bench ? 5 : 4} title="Notes and photos">
          <div className="space-y-4 rounded-md border-3 border-rule bg-surface p-4 sm:p-5">
            <TextField
              name="notes"
              label="Notes (optional)"
              multiline
              maxLength={NOTES_MAX_LENGTH}
              hint="Anything a moderator should know: the meter you used, the packs, the stack. Markdown works for lists and links."
            />
            <EvidencePhotos draftKey={draftKey} onChange={(ids) => setValue("photoIds", ids)} />
          </div>
        </Step>

        <div className="flex flex-col gap-3 border-t-3 border-rule pt-6 sm:flex-row sm:items-center">
          <button type="submit" className="sb-button min-h-14 px-8 text-lead" disabled={formState.isSubmitting}>
            {formState.isSubmitting ? "Sending…" : mode.kind === "create" ? "Send for review" : "Save changes"}
          </button>
          <Link href="/my/submissions" className="sb-button sb-button-quiet min-h-14">
            {mode.kind === "create" ? "My submissions" : "Back without saving"}
          </Link>
          <p id="form-intro" className="text-small text-muted sm:ml-auto sm:max-w-sm">
            A moderator reviews every submission before its values count. You will get an e-mail at each step.
          </p>
        </div>
      </form>
    </FormProvider>
  );
}
