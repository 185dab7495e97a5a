"use client";

import type { ReactNode } from "react";
import { useFieldArray, useFormContext } from "react-hook-form";
import { formatFigure } from "@/lib/catalogue/format";
import { MAX_BENCH_POINTS, MAX_CYCLES, MAX_READINGS } from "@/lib/submissions/limits";
import { MEASURED_AT, MEASURED_AT_LABELS } from "@/lib/vocabulary";
import { BenchCaution, ChargingCaution, ProbeCaution } from "./cautions";
import { emptyCycle, emptyPoint, emptyReading, type FamilyOption, type SubmissionDraft } from "./draft";
import { ErrorText, NumberField, SelectField, fieldId, useFieldError, type DraftPath } from "./field";

// The three kinds of evidence, each with its cautions beside it. Rows are added and removed with
// react-hook-form's field arrays; field names are the schema's paths ("cycles.2.chargedMah").

/** "× 0.02 V/V" beside a setting box: what one step is worth. */
const stepUnit = (step: number, unit: string) => `× ${formatFigure(step, 6)} ${unit}`;

type Setting = "voltage" | "current" | "offset";

/** A family's range, step and unit for one of the three settings. */
function rangeOf(family: FamilyOption, which: Setting) {
  const [min, max, step, unit] =
    which === "voltage"
      ? [family.voltageScaleMin, family.voltageScaleMax, family.voltageScaleStep, family.voltageScaleUnit]
      : which === "current"
        ? [family.currentScaleMin, family.currentScaleMax, family.currentScaleStep, family.currentScaleUnit]
        : [family.currentOffsetMin, family.currentOffsetMax, family.currentOffsetStep, family.currentOffsetUnit];
  return { min, max, step, unit };
}

function settingHint(family: FamilyOption | null, which: Setting): string | undefined {
  if (!family) return "Choose the firmware family first to see its steps and range.";
  const { min, max, step, unit } = rangeOf(family, which);
  return `A whole number of steps (1 step = ${formatFigure(step, 6)} ${unit}), ${min} to ${max} in ${family.name}.`;
}

/** A box for a setting as the firmware stores it: a whole number of the family's steps (the offset may be negative). */
export function SettingField({ name, label, family, setting }: { name: DraftPath; label: string; family: FamilyOption | null; setting: Setting }) {
  const range = family ? rangeOf(family, setting) : null;
  return (
    <NumberField
      name={name}
      label={label}
      kind={setting === "offset" ? "signed" : "whole"}
      unit={range ? stepUnit(range.step, range.unit) : undefined}
      hint={settingHint(family, setting)}
    />
  );
}

function Section({ id, title, intro, caution, children }: { id: string; title: string; intro: ReactNode; caution: ReactNode; children: ReactNode }) {
  const error = useFieldError(id);
  return (
    <fieldset
      id={fieldId(id)}
      className="space-y-4 rounded-md border-3 border-rule bg-surface p-4 sm:p-5"
      aria-describedby={error ? `${fieldId(id)}-error` : undefined}
    >
      <legend className="px-1 font-display text-heading uppercase">{title}</legend>
      <div className="grid gap-4 lg:grid-cols-[1fr_20rem] lg:items-start">
        <div className="space-y-4">
          <p className="max-w-prose">{intro}</p>
          <ErrorText id={`${fieldId(id)}-error`} message={error} />
          {children}
        </div>
        {caution}
      </div>
    </fieldset>
  );
}

function RowFrame({ title, onRemove, children }: { title: string; onRemove?: () => void; children: ReactNode }) {
  return (
    <div className="rounded-md border-2 border-rule-soft bg-paper p-3">
      <div className="mb-2 flex items-center justify-between gap-2">
        <h4 className="font-display text-lg font-bold tracking-wide uppercase">{title}</h4>
        {onRemove && (
          <button type="button" onClick={onRemove} className="sb-button sb-button-quiet min-h-10 px-3 py-1 text-small">
            Remove {title.toLowerCase()}
          </button>
        )}
      </div>
      <div className="grid gap-3 sm:grid-cols-2">{children}</div>
    </div>
  );
}

export function VoltageCheckSection({ family }: { family: FamilyOption | null }) {
  const { control } = useFormContext<SubmissionDraft>();
  const { fields, append, remove } = useFieldArray({ control, name: "voltageCheck.readings" });
  const listError = useFieldError("voltageCheck.readings");
  return (
    <Section
      id="voltageCheck"
      title="Voltage check"
      intro="Compare the pack voltage your display shows with a multimeter on the same pack at the same moment. One reading is enough; two or three at different charge levels are better."
      caution={<ProbeCaution />}
    >
      <div className="max-w-sm">
        <SettingField name="voltageCheck.scaleUsed" label="Voltage scale set while you measured" family={family} setting="voltage" />
      </div>
      <ErrorText id="f-voltageCheck-readings-error" message={listError} />
      {fields.map((f, i) => (
        <RowFrame key={f.id} title={`Reading ${i + 1}`} onRemove={fields.length > 1 ? () => remove(i) : undefined}>
          <NumberField name={`voltageCheck.readings.${i}.cells`} label="Pack cells" unit="S" kind="whole" />
          <NumberField name={`voltageCheck.readings.${i}.reportedVolts`} label="Display shows" unit="V" />
          <NumberField name={`voltageCheck.readings.${i}.measuredVolts`} label="Multimeter reads" unit="V" />
          <SelectField
            name={`voltageCheck.readings.${i}.measuredAt`}
            label="Measured at"
            options={MEASURED_AT.map((m) => ({ value: m, label: MEASURED_AT_LABELS[m] }))}
          />
        </RowFrame>
      ))}
      {fields.length < MAX_READINGS && (
        <button type="button" className="sb-button sb-button-quiet" onClick={() => append(emptyReading())}>
          Add a reading
        </button>
      )}
    </Section>
  );
}

export function CyclesSection({ family }: { family: FamilyOption | null }) {
  const { control } = useFormContext<SubmissionDraft>();
  const { fields, append, remove } = useFieldArray({ control, name: "cycles" });
  const current = family ? rangeOf(family, "current") : null;
  const unit = current ? stepUnit(current.step, current.unit) : undefined;
  return (
    <Section
      id="cycles"
      title="Fly-and-recharge cycles"
      intro={
        <>
          For each flight: the mAh your display said you used, the mAh the charger put back, and the current scale that was set during that flight. Three to
          five cycles are usual; after each, people move the scale and fly again. Rounding so the display slightly over-reports use is the safe side (common
          practice).
        </>
      }
      caution={<ChargingCaution />}
    >
      {fields.map((f, i) => (
        <RowFrame key={f.id} title={`Cycle ${i + 1}`} onRemove={fields.length > 1 ? () => remove(i) : undefined}>
          <NumberField name={`cycles.${i}.scaleUsed`} label="Current scale set" kind="whole" unit={unit} />
          <NumberField name={`cycles.${i}.reportedMah`} label="Display said used" unit="mAh" />
          <NumberField name={`cycles.${i}.chargedMah`} label="Charger put back" unit="mAh" />
          <NumberField name={`cycles.${i}.ratedMah`} label="Pack rated" unit="mAh" kind="whole" />
          <NumberField name={`cycles.${i}.cells`} label="Pack cells" unit="S" kind="whole" />
        </RowFrame>
      ))}
      <p className="text-small text-muted">{settingHint(family, "current")}</p>
      {fields.length < MAX_CYCLES && (
        <button type="button" className="sb-button sb-button-quiet" onClick={() => append(emptyCycle())}>
          Add a cycle
        </button>
      )}
    </Section>
  );
}

export function BenchSection({ family }: { family: FamilyOption | null }) {
  const { control } = useFormContext<SubmissionDraft>();
  const { fields, append, remove } = useFieldArray({ control, name: "bench.points" });
  const listError = useFieldError("bench.points");
  return (
    <Section
      id="bench"
      title="Bench points"
      intro="At two or more steady loads, read the current your display shows and the current a DC clamp meter shows on the battery lead. We fit a straight line through the points: its slope checks the current scale, where it crosses zero checks the offset."
      caution={<BenchCaution />}
    >
      <div className="grid max-w-2xl gap-3 sm:grid-cols-2">
        <SettingField name="bench.scaleUsed" label="Current scale set during the test" family={family} setting="current" />
        <SettingField name="bench.offsetUsed" label="Current offset set during the test" family={family} setting="offset" />
      </div>
      <ErrorText id="f-bench-points-error" message={listError} />
      {fields.map((f, i) => (
        <RowFrame key={f.id} title={`Point ${i + 1}`} onRemove={fields.length > 2 ? () => remove(i) : undefined}>
          <NumberField name={`bench.points.${i}.reportedAmps`} label="Display shows" unit="A" kind="signed" />
          <NumberField name={`bench.points.${i}.measuredAmps`} label="Clamp meter reads" unit="A" />
        </RowFrame>
      ))}
      {fields.length < MAX_BENCH_POINTS && (
        <button type="button" className="sb-button sb-button-quiet" onClick={() => append(emptyPoint())}>
          Add a point
        </button>
      )}
    </Section>
  );
}
