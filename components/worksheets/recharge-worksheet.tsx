"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent, type ReactNode } from "react";
import { formatFigure } from "@/lib/catalogue/format";
import { CHARGING_CAUTIONS } from "@/lib/calibration/cautions";
import type { RoundedSetting } from "@/lib/calibration";
import { stepInput, type WorksheetView } from "@/lib/worksheets/recharge-input";
import { ConvergencePlot } from "./convergence-plot";
import { checked, errorsOf, FieldError, sendJson, TakenBack, type Errors } from "./saved-worksheet";

// The fly-and-recharge worksheet: each iteration is sent on its own and stored whole, then the page
// shows what the recharge maths makes of all of them (lib/calibration/recharge.ts).

const pct = (e: number | null) => (e == null ? "—" : `${e >= 0 ? "+" : ""}${formatFigure(e * 100, 2)} %`);

function Rounding({ name, r, recommended }: { name: string; r: RoundedSetting; recommended: boolean }) {
  return (
    <div className={`rounded-md border-2 p-3 ${recommended ? "border-signal" : "border-rule"}`} data-testid={`rounding-${name}`}>
      <p className="text-small text-muted">Rounded {name}{recommended ? " — recommended" : ""}</p>
      <p className="font-mono text-lg">{r.setting}</p>
      <p className="text-small">Display reads {r.reads === "true" || r.readingError == null ? "true" : `${r.reads} by ${formatFigure(Math.abs(r.readingError) * 100, 2)} %`}</p>
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
  const router = useRouter();
  const [sheet, setSheet] = useState(initial);
  const [errors, setErrors] = useState<Errors>({});
  const [busy, setBusy] = useState(false);
  const [formKey, setFormKey] = useState(0);
  const r = sheet.result;
  const nextScale = r ? r.recommendedSetting : sheet.startingScale;

  async function addStep(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const f = new FormData(event.currentTarget);
    const num = (k: string) => (String(f.get(k) ?? "").trim() === "" ? null : Number(f.get(k)));
    const body = { scaleUsed: num("scaleUsed"), reportedMah: num("reportedMah"), chargedMah: num("chargedMah"), fullyRecharged: f.get("fullyRecharged") === "on" };
    await send(async () => {
      // the shared schema first, with the server's words, before any round trip
      const step = checked(stepInput, body);
      setSheet((await sendJson<{ worksheet: WorksheetView }>(`/api/v1/garage/worksheets/${sheet.id}/steps`, "POST", step)).worksheet);
      setFormKey((k) => k + 1);
    });
  }

  /** Runs one request: busy meanwhile, its refusal shown by field. */
  async function send(request: () => Promise<void>) {
    setBusy(true);
    try {
      await request();
      setErrors({});
    } catch (e) {
      setErrors(errorsOf(e));
    } finally {
      setBusy(false);
    }
  }

  // a mistyped iteration: the server keeps it, struck out and no longer counted
  const last = sheet.steps.at(-1);
  const takeBack = (position: number) =>
    send(async () => {
      setSheet((await sendJson<{ worksheet: WorksheetView }>(`/api/v1/garage/worksheets/${sheet.id}/steps/${position}`, "DELETE")).worksheet);
      // the next iteration's scale was filled in from the taken-back one: fill it in afresh
      setFormKey((k) => k + 1);
    });

  const publish = () =>
    send(async () => {
      const { submission } = await sendJson<{ submission: { id: number } }>(`/api/v1/garage/worksheets/${sheet.id}/publish`, "POST", {});
      router.push(`/my/submissions?sent=${submission.id}`);
    });

  const field = (name: string, label: string, hint?: string, defaultValue?: number) => (
    <div>
      <label htmlFor={`w-${name}`} className="mb-1 block font-semibold">{label}</label>
      <input id={`w-${name}`} name={name} type="number" inputMode="decimal" className="sb-field" defaultValue={defaultValue}
        aria-invalid={errors[name] ? true : undefined} aria-describedby={errors[name] ? `w-${name}-error` : undefined} />
      {hint && <p className="mt-1 text-small text-muted">{hint}</p>}
      {errors[name] && <p id={`w-${name}-error`} className="mt-1 font-semibold text-fault"><span aria-hidden="true">⚠ </span>{errors[name].join(" ")}</p>}
    </div>
  );

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
            <tr className="text-left text-muted"><th className="py-1 pr-3">#</th><th className="pr-3">Scale used</th><th className="pr-3">Reported mAh</th><th className="pr-3">Charged mAh</th><th className="pr-3">Display error</th><th>Implied scale</th></tr>
          </thead>
          <tbody className="block space-y-2 sm:table-row-group sm:space-y-0">
            {(r?.iterations ?? []).map((it) => (
              <tr key={it.index} className="grid grid-cols-2 gap-x-3 gap-y-2 rounded-md border-2 border-rule bg-surface p-3 sm:table-row sm:rounded-none sm:border-0 sm:border-t sm:bg-transparent sm:p-0">
                <td className="col-span-2 font-semibold sm:table-cell sm:py-1 sm:pr-3 sm:font-normal"><span className="sm:hidden">Iteration </span>{it.index + 1}</td>
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
      <TakenBack removed={sheet.removed} describe={(x) => <>scale {x.scaleUsed}, reported {formatFigure(x.reportedMah, 0)} mAh, charged {formatFigure(x.chargedMah, 0)} mAh</>} />

      {r && (
        <section aria-labelledby="next-title" className="space-y-3 rounded-md border-3 border-rule bg-surface p-4">
          <h2 id="next-title" className="font-display text-heading uppercase">Next scale</h2>
          <p>Exact: <span className="font-mono">{formatFigure(r.next.exact, 2)}</span> (from cycle {r.basedOn + 1}). Enter <strong className="font-mono" data-testid="recommended">{r.recommendedSetting}</strong>.</p>
          <div className="grid gap-3 sm:grid-cols-2">
            <Rounding name="down" r={r.next.down} recommended={r.next.safeSide === "down"} />
            <Rounding name="up" r={r.next.up} recommended={r.next.safeSide === "up"} />
          </div>
          <p className="text-small">{r.next.why}</p>
          <p className={`font-semibold ${r.stop.met ? "text-ink" : "text-muted"}`} data-testid="stop">{r.stop.met ? "✓ " : ""}{r.stop.message}</p>
          <p className="text-small text-muted">{r.stop.rule}</p>
        </section>
      )}

      {sheet.warnings.length > 0 && (
        <ul className="space-y-1 rounded-md border-2 border-caution-edge bg-caution p-3 text-small" data-testid="worksheet-warnings">
          {sheet.warnings.map((w) => <li key={w.field + w.message}>⚠ {w.message}</li>)}
        </ul>
      )}

      {r && r.convergence.length > 0 && <ConvergencePlot worksheet={r} />}

      {sheet.submissionId == null ? (
        <>
          <form key={formKey} onSubmit={addStep} noValidate className="space-y-3 rounded-md border-2 border-rule bg-surface p-4" data-testid="step-form">
            <h2 className="font-display text-lg font-bold tracking-wide uppercase">Add iteration {sheet.steps.length + 1}</h2>
            <p className="text-small">Fly a pack down to your usual landing voltage with this scale, note the mAh the OSD shows, then recharge fully and note what the charger put back.</p>
            {errors.input && <p role="alert" className="font-semibold text-fault">⚠ {errors.input.join(" ")}</p>}
            <div className="grid gap-3 sm:grid-cols-3">
              {field("scaleUsed", "Scale used", undefined, nextScale)}
              {field("reportedMah", "Reported mAh", "What the OSD showed at landing")}
              {field("chargedMah", "Charged mAh", "What the charger put back")}
            </div>
            <label className="flex items-center gap-2 font-semibold"><input type="checkbox" name="fullyRecharged" defaultChecked className="size-5" /> The charger finished (pack fully recharged)</label>
            <button type="submit" className="sb-button" disabled={busy}>{busy ? "Saving…" : "Save iteration"}</button>
          </form>
          {r && (
            <div className="space-y-2">
              {errors.steps && <p className="font-semibold text-fault">⚠ {errors.steps.join(" ")}</p>}
              {errors.firmwareVersion && <p className="font-semibold text-fault">⚠ {errors.firmwareVersion.join(" ")}</p>}
              <button type="button" className="sb-button" onClick={publish} disabled={busy} data-testid="publish">Publish to Shuntbook</button>
              <p className="text-small text-muted">Sends the recommended scale and every fully recharged cycle as a contribution. A moderator reviews it like any other.</p>
            </div>
          )}
        </>
      ) : (
        <p className="font-semibold" data-testid="published">Published as submission #{sheet.submissionId}: pending review.</p>
      )}

      {/* shown before the first cycle too: every iteration means charging a pack again */}
      {(
        <details open={sheet.steps.length === 0} className="rounded-md border-2 border-caution-edge bg-caution p-3 text-small">
          <summary className="font-semibold">Charging cautions</summary>
          <ul className="mt-2 list-disc space-y-1 pl-5">{(r?.cautions ?? CHARGING_CAUTIONS).map((c) => <li key={c.text}>{c.text} <span className="text-muted">({c.source})</span></li>)}</ul>
        </details>
      )}
    </div>
  );
}
