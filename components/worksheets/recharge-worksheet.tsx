"use client";

import { useState, type ReactNode } from "react";
import { formatFigure } from "@/lib/catalogue/format";
import { CHARGING_CAUTIONS } from "@/lib/calibration/cautions";
import type { RoundedSetting } from "@/lib/calibration";
import { stepInput, type WorksheetView } from "@/lib/worksheets/recharge-input";
import { ConvergencePlot } from "./convergence-plot";
import { errorsOf, showServerErrors } from "@/components/form-errors";
import { useSchemaForm } from "@/components/hooks/use-schema-form";
import { useSavedWorksheet } from "@/components/hooks/use-worksheet";
import { FieldError, numberOrNull, TakenBack, Warnings, type Errors } from "./saved-worksheet";
import { TitledSection } from "@/components/titled-section";

// The fly-and-recharge worksheet: each iteration is sent on its own and stored whole, then the page
// shows what the recharge maths makes of all of them (lib/calibration/recharge.ts).

const pct = (e: number | null) => (e == null ? "—" : `${e >= 0 ? "+" : ""}${formatFigure(e * 100, 2)} %`);

function Rounding({ name, r, recommended }: { name: string; r: RoundedSetting; recommended: boolean }) {
  return (
    <div className={`rounded-md border-2 p-3 ${recommended ? "border-signal" : "border-rule"}`} data-testid={`rounding-${name}`}>
      <p className="text-small text-muted">
        Rounded {name}
        {recommended ? " — recommended" : ""}
      </p>
      <p className="font-mono text-lg">{r.setting}</p>
      <p className="text-small">
        Display reads {r.reads === "true" || r.readingError == null ? "true" : `${r.reads} by ${formatFigure(Math.abs(r.readingError) * 100, 2)} %`}
      </p>
    </div>
  );
}

/** One figure of an iteration: its column name is shown in the cell itself on a phone, where the header row is hidden. */
function Cell({ label, children }: { label: string; children: ReactNode }) {
  return (
    <td className="block sm:table-cell sm:pr-3">
      <span className="block text-muted sm:hidden">{label}</span>
      <span className="font-mono">{children}</span>
    </td>
  );
}

export function RechargeWorksheetView({ initial }: { initial: WorksheetView }) {
  const { sheet, add, remove, publish, busy } = useSavedWorksheet(initial);
  // what the last take-back or publish was refused for; a new iteration's send replaces it
  const [errors, setErrors] = useState<Errors>({});
  const [formKey, setFormKey] = useState(0);
  const r = sheet.result;
  const nextScale = r ? r.recommendedSetting : sheet.startingScale;
  const outcome = { onSuccess: () => setErrors({}), onError: (e: Error) => setErrors(errorsOf(e)) };

  // a mistyped iteration: the server keeps it, struck out and no longer counted
  const last = sheet.steps.at(-1);
  const takeBack = (position: number) =>
    remove.mutate(position, {
      onError: outcome.onError,
      // the next iteration's scale was filled in from the taken-back one: fill it in afresh
      onSuccess: () => {
        outcome.onSuccess();
        setFormKey((k) => k + 1);
      },
    });
  const publishIt = () => publish.mutate(undefined, outcome);

  return (
    <div className="space-y-6">
      <p>
        Started from <span className="font-mono">{sheet.startingScale}</span>{" "}
        {sheet.startingSource === "published" ? "— the board's published recommended current scale" : "— the scale the quad flew with (nothing published yet)"}.
        Pack: {sheet.cells}S, {sheet.ratedMah} mAh rated. Firmware family: {sheet.familyName}.
      </p>

      {sheet.steps.length > 0 && (
        // Mobile first: below sm each iteration is a card (the column names shown in each cell,
        // the header row hidden), from sm up the same markup is an ordinary table.
        <table className="block w-full text-small sm:table" data-testid="iterations">
          <caption className="mb-2 block text-left font-semibold sm:table-caption">Iterations</caption>
          <thead className="hidden sm:table-header-group">
            <tr className="text-left text-muted">
              <th className="py-1 pr-3">#</th>
              <th className="pr-3">Scale used</th>
              <th className="pr-3">Reported mAh</th>
              <th className="pr-3">Charged mAh</th>
              <th className="pr-3">Display error</th>
              <th>Implied scale</th>
            </tr>
          </thead>
          <tbody className="block space-y-2 sm:table-row-group sm:space-y-0">
            {(r?.iterations ?? []).map((it) => (
              <tr
                key={it.index}
                className="grid grid-cols-2 gap-x-3 gap-y-2 rounded-md border-2 border-rule bg-surface p-3 sm:table-row sm:rounded-none sm:border-0 sm:border-t sm:bg-transparent sm:p-0"
              >
                <td className="col-span-2 font-semibold sm:table-cell sm:py-1 sm:pr-3 sm:font-normal">
                  <span className="sm:hidden">Iteration </span>
                  {it.index + 1}
                </td>
                <Cell label="Scale used">{it.scaleUsed}</Cell>
                <Cell label="Reported mAh">{formatFigure(it.reportedMah, 0)}</Cell>
                <Cell label="Charged mAh">{formatFigure(it.chargedMah, 0)}</Cell>
                <Cell label="Display error">{pct(it.ratio - 1)}</Cell>
                <td className="col-span-2 sm:table-cell">
                  <span className="block text-muted sm:hidden">Implied scale</span>
                  <span className="font-mono">{formatFigure(it.impliedScale, 1)}</span>
                  {it.excludedBecause ? <span className="mt-1 block text-fault sm:ml-2 sm:mt-0 sm:inline">left out: {it.excludedBecause}</span> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {sheet.submissionId == null && last && (
        <div>
          <button type="button" className="sb-button sb-button-quiet" disabled={busy} onClick={() => takeBack(last.position)} data-testid="take-back">
            Take back iteration {last.position + 1}
          </button>
          <FieldError messages={errors.position} />
        </div>
      )}
      <TakenBack
        removed={sheet.removed}
        describe={(x) => (
          <>
            scale {x.scaleUsed}, reported {formatFigure(x.reportedMah, 0)} mAh, charged {formatFigure(x.chargedMah, 0)} mAh
          </>
        )}
      />

      {r && (
        <TitledSection id="next" title="Next scale" className="space-y-3 rounded-md border-3 border-rule bg-surface p-4">
          <p>
            Exact: <span className="font-mono">{formatFigure(r.next.exact, 2)}</span> (from cycle {r.basedOn + 1}). Enter{" "}
            <strong className="font-mono" data-testid="recommended">
              {r.recommendedSetting}
            </strong>
            .
          </p>
          <div className="grid gap-3 sm:grid-cols-2">
            <Rounding name="down" r={r.next.down} recommended={r.next.recommendedSide === "down"} />
            <Rounding name="up" r={r.next.up} recommended={r.next.recommendedSide === "up"} />
          </div>
          <p className="text-small">{r.next.why}</p>
          <p className={`font-semibold ${r.stop.met ? "text-ink" : "text-muted"}`} data-testid="stop">
            {r.stop.met ? "✓ " : ""}
            {r.stop.message}
          </p>
          <p className="text-small text-muted">{r.stop.rule}</p>
        </TitledSection>
      )}

      <Warnings items={sheet.warnings} />

      {r && r.convergence.length > 0 && <ConvergencePlot worksheet={r} />}

      {sheet.submissionId == null ? (
        <>
          <StepForm
            key={formKey}
            number={sheet.steps.length + 1}
            nextScale={nextScale}
            add={add}
            busy={busy}
            requestErrors={errors}
            onSend={() => setErrors({})}
            onSaved={() => setFormKey((k) => k + 1)}
          />
          {r && (
            <div className="space-y-2">
              {errors.steps && <p className="font-semibold text-fault">⚠ {errors.steps.join(" ")}</p>}
              {errors.firmwareVersion && <p className="font-semibold text-fault">⚠ {errors.firmwareVersion.join(" ")}</p>}
              <button type="button" className="sb-button" onClick={publishIt} disabled={busy} data-testid="publish">
                Publish to Shuntbook
              </button>
              <p className="text-small text-muted">
                Sends the recommended scale and every fully recharged cycle as a contribution. A moderator reviews it like any other.
              </p>
            </div>
          )}
        </>
      ) : (
        <p className="font-semibold" data-testid="published">
          Published as submission #{sheet.submissionId}: pending review.
        </p>
      )}

      {/* shown before the first cycle too: every iteration means charging a pack again */}
      {
        <details open={sheet.steps.length === 0} className="rounded-md border-2 border-caution-edge bg-caution p-3 text-small">
          <summary className="font-semibold">Charging cautions</summary>
          <ul className="mt-2 list-disc space-y-1 pl-5">
            {(r?.cautions ?? CHARGING_CAUTIONS).map((c) => (
              <li key={c.text}>{c.text}</li>
            ))}
          </ul>
        </details>
      }
    </div>
  );
}

type StepFields = { scaleUsed: string; reportedMah: string; chargedMah: string; fullyRecharged: boolean };

/** One iteration, checked with the server's own schema before it is sent. */
function StepForm(props: {
  number: number;
  nextScale: number;
  add: ReturnType<typeof useSavedWorksheet<WorksheetView>>["add"];
  busy: boolean;
  requestErrors: Errors;
  onSend: () => void;
  onSaved: () => void;
}) {
  const { form, errors: formErrors } = useSchemaForm<StepFields>(stepInput, {
    defaultValues: { scaleUsed: String(props.nextScale), reportedMah: "", chargedMah: "", fullyRecharged: true },
    toBody: (v) => ({
      scaleUsed: numberOrNull(v.scaleUsed),
      reportedMah: numberOrNull(v.reportedMah),
      chargedMah: numberOrNull(v.chargedMah),
      fullyRecharged: v.fullyRecharged === true,
    }),
  });
  const errors = { ...props.requestErrors, ...formErrors };
  const submit = form.handleSubmit((step) => {
    props.onSend();
    props.add.mutate(step, { onSuccess: props.onSaved, onError: (e) => showServerErrors(form.setError, e) });
  }, props.onSend);
  const field = (name: "scaleUsed" | "reportedMah" | "chargedMah", label: string, hint?: string) => (
    <div>
      <label htmlFor={`w-${name}`} className="mb-1 block font-semibold">
        {label}
      </label>
      <input
        id={`w-${name}`}
        type="number"
        inputMode="decimal"
        className="sb-field"
        {...form.register(name)}
        aria-invalid={errors[name] ? true : undefined}
        aria-describedby={errors[name] ? `w-${name}-error` : undefined}
      />
      {hint && <p className="mt-1 text-small text-muted">{hint}</p>}
      {errors[name] && (
        <p id={`w-${name}-error`} className="mt-1 font-semibold text-fault">
          <span aria-hidden="true">⚠ </span>
          {errors[name].join(" ")}
        </p>
      )}
    </div>
  );
  return (
    <form onSubmit={submit} noValidate className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid="step-form">
      <h2 className="font-display text-lg font-bold tracking-wide uppercase">Add iteration {props.number}</h2>
      <p className="text-small">
        Fly a pack down to your usual landing voltage with this scale, note the mAh the OSD shows, then recharge fully and note what the charger put back.
      </p>
      {errors.input && (
        <p role="alert" className="font-semibold text-fault">
          ⚠ {errors.input.join(" ")}
        </p>
      )}
      <div className="grid gap-3 sm:grid-cols-3">
        {field("scaleUsed", "Scale used")}
        {field("reportedMah", "Reported mAh", "What the OSD showed at landing")}
        {field("chargedMah", "Charged mAh", "What the charger put back")}
      </div>
      <label className="flex items-center gap-2 font-semibold">
        <input type="checkbox" className="size-5" {...form.register("fullyRecharged")} /> The charger finished (pack fully recharged)
      </label>
      <button type="submit" className="sb-button" disabled={props.busy}>
        {props.busy ? "Saving…" : "Save iteration"}
      </button>
    </form>
  );
}
