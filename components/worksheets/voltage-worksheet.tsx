"use client";

import { useState } from "react";
import { ProbeCaution } from "@/components/submission/cautions";
import { formatFigure } from "@/lib/catalogue/format";
import { voltageReadingInput, voltageStartInput, type VoltageSheetView } from "@/lib/worksheets/voltage-input";
import { MEASURED_AT, type MeasuredAt } from "@/lib/vocabulary";
import { errorsOf, showServerErrors } from "@/components/form-errors";
import { useSchemaForm } from "@/components/hooks/use-schema-form";
import { useSavedWorksheet, useStartWorksheet } from "@/components/hooks/use-worksheet";
import { FieldError, NumberInput, numberOrUndefined, PublishPanel, SavedEntries, Warnings } from "./saved-worksheet";

// The voltage worksheet, saved on the server pair by pair (lib/worksheets/voltage.ts), so a
// builder can pick it up again on a phone at the field. The server judges each new pair with the
// earlier ones (lib/calibration/voltage.ts) and answers with the worksheet computed.

const PLACE: Record<MeasuredAt, string> = { main_lead: "main lead", balance_outer_pins: "balance plug, outer pins" };
const volts = (v: number) => `${formatFigure(v, 2)} V`;

/** The quad's voltage worksheet: the open one, or a start form with the scale in force. */
export function VoltageWorksheet({ quadId, startingScale, initial }: { quadId: number; startingScale: number | null; initial: VoltageSheetView | null }) {
  const [sheet, setSheet] = useState(initial);
  const start = useStartWorksheet<VoltageSheetView>(setSheet);
  const { form, errors } = useSchemaForm<{ scaleUsed: string }>(voltageStartInput, {
    defaultValues: { scaleUsed: startingScale == null ? "" : String(startingScale) },
    toBody: (v) => ({ kind: "voltage", quadId, scaleUsed: numberOrUndefined(v.scaleUsed) }),
  });
  const submit = form.handleSubmit((body) => start.mutate(body, { onError: (e) => showServerErrors(form.setError, e) }));
  if (sheet) return <VoltageSheet initial={sheet} />;

  return (
    <div className="space-y-5">
      <ProbeCaution />
      <form onSubmit={submit} noValidate className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid="voltage-start">
        <h2 className="font-display text-lg font-bold tracking-wide uppercase">Start a voltage check</h2>
        <FieldError messages={[...(errors.input ?? []), ...(errors.quadId ?? [])]} />
        <NumberInput
          idPrefix="vs"
          field={form.register("scaleUsed")}
          label="Voltage scale in force"
          errors={errors}
          hint={
            startingScale != null
              ? "The board's published recommended value; change it if your quad runs another."
              : "Nothing is published for this board yet: enter the value your quad runs with."
          }
        />
        <button type="submit" className="sb-button w-full sm:w-auto" disabled={start.isPending}>
          {start.isPending ? "Starting…" : "Start"}
        </button>
      </form>
    </div>
  );
}

export function VoltageSheet({ initial }: { initial: VoltageSheetView }) {
  const { sheet, add, remove, publish, busy } = useSavedWorksheet(initial);
  // a saved reading starts the next from a fresh form, its cells and place taken from the last
  const [formKey, setFormKey] = useState(0);
  const r = sheet.result;
  const open = sheet.submissionId == null;

  return (
    <div className="space-y-5">
      <ProbeCaution />
      <p>
        Voltage scale in force: <span className="font-mono">{sheet.scaleUsed}</span>{" "}
        {sheet.startingSource === "published" ? "(the board's published recommended value)" : "(your own)"}. Firmware family: {sheet.familyName}.
      </p>

      <SavedEntries
        id="v-readings"
        title="Readings"
        testId="voltage-readings"
        entries={sheet.readings}
        removed={sheet.removed}
        open={open}
        busy={busy}
        onRemove={(position) => remove.mutate(position)}
        removeErrors={errorsOf(remove.error)}
        describe={(x) => (
          <>
            {x.cells}S — display <span className="font-mono">{volts(x.reportedVolts)}</span>, meter <span className="font-mono">{volts(x.measuredVolts)}</span>{" "}
            <span className="text-small text-muted">({PLACE[x.measuredAt]})</span>
          </>
        )}
      />

      {r && (
        <section aria-labelledby="v-result" className="space-y-2 rounded-md border-3 border-rule bg-surface p-4" data-testid="voltage-result">
          <h2 id="v-result" className="font-display text-heading uppercase">
            {r.verdict === "keep" ? "Keep" : "Enter"}{" "}
            <span className="font-mono" data-testid="voltage-answer">
              {r.answer}
            </span>
          </h2>
          <p>{r.message}</p>
          <p className="text-small">
            Exact scale <span className="font-mono">{formatFigure(r.impliedScale, 2)}</span> (the median of your pairs).
            {r.verdict === "change" && <> {r.rounding.why}</>}
          </p>
          <p className="text-small text-muted">Tolerance ±{r.tolerance.relative * 100} %.</p>
        </section>
      )}
      <Warnings items={sheet.warnings} />

      {open && <ReadingForm key={formKey} sheet={sheet} add={add} busy={busy} onSaved={() => setFormKey((k) => k + 1)} />}

      <PublishPanel
        submissionId={sheet.submissionId}
        ready={r != null}
        busy={busy}
        errors={errorsOf(publish.error)}
        onPublish={() => publish.mutate()}
        what="Sends the recommended voltage scale with every reading above as its multimeter evidence."
      />
    </div>
  );
}

type ReadingFields = { cells: string; reportedVolts: string; measuredVolts: string; measuredAt: MeasuredAt };

function ReadingForm({
  sheet,
  add,
  busy,
  onSaved,
}: {
  sheet: VoltageSheetView;
  add: ReturnType<typeof useSavedWorksheet<VoltageSheetView>>["add"];
  busy: boolean;
  onSaved: () => void;
}) {
  const last = sheet.readings.at(-1);
  const { form, errors } = useSchemaForm<ReadingFields>(voltageReadingInput, {
    defaultValues: { cells: last ? String(last.cells) : "", reportedVolts: "", measuredVolts: "", measuredAt: last?.measuredAt ?? "main_lead" },
    toBody: (v) => ({
      cells: numberOrUndefined(v.cells),
      reportedVolts: numberOrUndefined(v.reportedVolts),
      measuredVolts: numberOrUndefined(v.measuredVolts),
      measuredAt: v.measuredAt ?? undefined,
    }),
  });
  const submit = form.handleSubmit(
    (body) => add.mutate(body, { onSuccess: onSaved, onError: (e) => showServerErrors(form.setError, e) }),
    () => add.reset(),
  );
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid="voltage-form">
      <h2 className="font-display text-lg font-bold tracking-wide uppercase">Add reading {sheet.readings.length + 1}</h2>
      <p className="text-small">With the pack at rest, read the display and the multimeter at the same moment.</p>
      <FieldError messages={[...(errors.input ?? []), ...(errors.readings ?? []), ...(errors.scaleUsed ?? [])]} />
      <div className="grid gap-3 sm:grid-cols-3">
        <NumberInput idPrefix="v" field={form.register("cells")} label="Cells (S)" errors={errors} />
        <NumberInput idPrefix="v" field={form.register("reportedVolts")} label="Display voltage (V)" errors={errors} hint="The whole pack" />
        <NumberInput idPrefix="v" field={form.register("measuredVolts")} label="Multimeter (V)" errors={errors} />
      </div>
      <fieldset aria-describedby={errors.measuredAt ? "v-measuredAt-error" : undefined}>
        <legend className="mb-1 font-semibold">Where the probes touched</legend>
        <div className="flex flex-wrap gap-x-5 gap-y-2">
          {MEASURED_AT.map((place) => (
            <label key={place} className="flex items-center gap-2">
              <input type="radio" value={place} className="size-5" {...form.register("measuredAt")} /> {PLACE[place]}
            </label>
          ))}
        </div>
        <FieldError id="v-measuredAt-error" messages={errors.measuredAt} />
      </fieldset>
      <button type="submit" className="sb-button w-full sm:w-auto" disabled={busy}>
        {add.isPending ? "Saving…" : "Save reading"}
      </button>
    </form>
  );
}
