"use client";

import { useState } from "react";
import { BenchCaution } from "@/components/submission/cautions";
import { formatFigure } from "@/lib/catalogue/format";
import { benchPointInput, benchStartInput, type BenchSheetView } from "@/lib/worksheets/bench-input";
import { errorsOf, showServerErrors } from "@/components/form-errors";
import { useSchemaForm } from "@/components/hooks/use-schema-form";
import { useSavedWorksheet, useStartWorksheet } from "@/components/hooks/use-worksheet";
import { FieldError, NumberInput, numberOrUndefined, PublishPanel, SavedEntries, Warnings } from "./saved-worksheet";
import { ResidualPlot } from "./residual-plot";

// The bench worksheet, saved on the server point by point (lib/worksheets/bench.ts): clamp-meter
// current beside the display's at several steady throttles, fitted on the server by
// lib/calibration/bench.ts with every earlier point. It means props on and motors under
// load, so the caution comes first and fly-and-recharge is suggested instead.

function Advice() {
  return (
    <>
      <p className="rounded-md border-2 border-rule bg-surface p-3 font-semibold">
        Most builders should use the fly-and-recharge worksheet instead: it needs no props-on bench run and the charger is the reference.
      </p>
      <BenchCaution />
    </>
  );
}

/** The quad's bench worksheet: the open one, or a start form with the scale and offset in force. */
export function BenchWorksheet(props: { quadId: number; startingScale: number | null; startingOffset: number | null; initial: BenchSheetView | null }) {
  const [sheet, setSheet] = useState(props.initial);
  const start = useStartWorksheet<BenchSheetView>(setSheet);
  const { form, errors } = useSchemaForm<{ scaleUsed: string; offsetUsed: string }>(benchStartInput, {
    defaultValues: { scaleUsed: props.startingScale == null ? "" : String(props.startingScale), offsetUsed: String(props.startingOffset ?? 0) },
    toBody: (v) => ({ kind: "bench", quadId: props.quadId, scaleUsed: numberOrUndefined(v.scaleUsed), offsetUsed: numberOrUndefined(v.offsetUsed) }),
  });
  const submit = form.handleSubmit((body) => start.mutate(body, { onError: (e) => showServerErrors(form.setError, e) }));
  if (sheet) return <BenchSheet initial={sheet} />;

  return (
    <div className="space-y-5">
      <Advice />
      <form onSubmit={submit} noValidate className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid="bench-start">
        <h2 className="font-display text-lg font-bold tracking-wide uppercase">Start a bench check</h2>
        <FieldError messages={[...(errors.input ?? []), ...(errors.quadId ?? [])]} />
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberInput
            idPrefix="bs"
            field={form.register("scaleUsed")}
            label="Current scale in force"
            errors={errors}
            hint={
              props.startingScale != null
                ? "The board's published recommended value; change it if your quad runs another."
                : "Nothing is published for this board yet: enter your quad's value."
            }
          />
          <NumberInput idPrefix="bs" field={form.register("offsetUsed")} label="Current offset in force" errors={errors} />
        </div>
        <button type="submit" className="sb-button w-full sm:w-auto" disabled={start.isPending}>
          {start.isPending ? "Starting…" : "Start"}
        </button>
      </form>
    </div>
  );
}

export function BenchSheet({ initial }: { initial: BenchSheetView }) {
  const { sheet, add, remove, publish, busy } = useSavedWorksheet(initial);
  // a saved point starts the next from a fresh form
  const [formKey, setFormKey] = useState(0);
  const v = sheet.result;
  const open = sheet.submissionId == null;

  return (
    <div className="space-y-5">
      <Advice />
      <p>
        In force: current scale <span className="font-mono">{sheet.scaleUsed}</span>, offset <span className="font-mono">{sheet.offsetUsed}</span>{" "}
        {sheet.startingSource === "published" ? "(the board's published recommended values)" : "(your own)"}. Firmware family: {sheet.familyName}.
      </p>

      <SavedEntries
        id="b-points"
        title="Points"
        testId="bench-points"
        entries={sheet.points}
        removed={sheet.removed}
        open={open}
        busy={busy}
        onRemove={(position) => remove.mutate(position)}
        removeErrors={errorsOf(remove.error)}
        describe={(p) => (
          <>
            clamp meter <span className="font-mono">{formatFigure(p.measuredAmps, 2)} A</span>, display{" "}
            <span className="font-mono">{formatFigure(p.reportedAmps, 2)} A</span>
          </>
        )}
      />

      {v && (
        <section aria-labelledby="b-result" className="space-y-3 rounded-md border-3 border-rule bg-surface p-4" data-testid="bench-result">
          <h2 id="b-result" className="font-display text-heading uppercase">
            Fit
          </h2>
          <p className="text-small">
            Gain <span className="font-mono">{formatFigure(v.fit.gain, 4)}</span>, intercept{" "}
            <span className="font-mono">{formatFigure(v.fit.interceptAmps, 2)} A</span>, r² <span className="font-mono">{formatFigure(v.fit.rSquared, 4)}</span>{" "}
            over {v.fit.n} points ({v.fit.method}).
          </p>
          <p>
            Current scale: exact <span className="font-mono">{formatFigure(v.scaleRounding.exact, 2)}</span>, down{" "}
            <span className="font-mono">{v.scaleRounding.down.setting}</span>, up <span className="font-mono">{v.scaleRounding.up.setting}</span>; enter{" "}
            <strong className="font-mono">{v.scaleRounding.recommended.setting}</strong>. {v.scaleRounding.why}
          </p>
          <p>
            Current offset: enter <strong className="font-mono">{v.offset.setting}</strong> (leaves {formatFigure(v.offset.displayedErrorAmpsAtZero, 3)} A at
            zero current).
          </p>
          <ResidualPlot residuals={v.residuals} />
        </section>
      )}
      <Warnings items={sheet.warnings} />

      {open && <PointForm key={formKey} sheet={sheet} add={add} busy={busy} onSaved={() => setFormKey((k) => k + 1)} />}

      <PublishPanel
        submissionId={sheet.submissionId}
        ready={v != null}
        busy={busy}
        errors={errorsOf(publish.error)}
        onPublish={() => publish.mutate()}
        what="Sends the recommended current scale and offset with every point above as its bench evidence."
      />
    </div>
  );
}

function PointForm({
  sheet,
  add,
  busy,
  onSaved,
}: {
  sheet: BenchSheetView;
  add: ReturnType<typeof useSavedWorksheet<BenchSheetView>>["add"];
  busy: boolean;
  onSaved: () => void;
}) {
  const { form, errors } = useSchemaForm<{ measuredAmps: string; reportedAmps: string }>(benchPointInput, {
    defaultValues: { measuredAmps: "", reportedAmps: "" },
    toBody: (v) => ({ measuredAmps: numberOrUndefined(v.measuredAmps), reportedAmps: numberOrUndefined(v.reportedAmps) }),
  });
  const submit = form.handleSubmit(
    (body) => add.mutate(body, { onSuccess: onSaved, onError: (e) => showServerErrors(form.setError, e) }),
    () => add.reset(),
  );
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid="bench-form">
      <h2 className="font-display text-lg font-bold tracking-wide uppercase">Add point {sheet.points.length + 1}</h2>
      <p className="text-small">Hold the throttle steady until both readings settle; clamp the battery lead, arrow towards the board.</p>
      <FieldError messages={[...(errors.input ?? []), ...(errors.points ?? [])]} />
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberInput idPrefix="b" field={form.register("measuredAmps")} label="Clamp meter (A)" errors={errors} />
        <NumberInput idPrefix="b" field={form.register("reportedAmps")} label="Display current (A)" errors={errors} />
      </div>
      <button type="submit" className="sb-button w-full sm:w-auto" disabled={busy}>
        {add.isPending ? "Saving…" : "Save point"}
      </button>
    </form>
  );
}
