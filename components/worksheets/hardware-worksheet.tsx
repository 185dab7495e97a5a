"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import { hardwareWorksheet, type HardwareWorksheet, type WorksheetFamily } from "@/lib/calibration";
import {
  comparisonVerdict,
  figureOrigin,
  HARDWARE_FIELD_PATHS,
  HARDWARE_FIGURE_KEYS,
  hardwareWorksheetInput,
  type FigureOrigin,
  type HardwareFigureKey,
  type HardwareFigures,
} from "@/lib/calibration/hardware-figures";
import { formatFigure } from "@/lib/catalogue/format";
import type { CurrentSensorKind } from "@/lib/vocabulary";
import { FieldError } from "./saved-worksheet";

// From the hardware: the board record's parts, overridable by what the builder reads off the
// board, worked out as they type by lib/calibration/hardware.ts. Nothing is stored or sent, so it
// is live state rather than a react-hook-form form.

type Props = {
  family: WorksheetFamily;
  quadId: number;
  board: { name: string; revisionLabel: string } | null;
  fromBoard: HardwareFigures;
  published: { voltageScale: number | null; currentScale: number | null };
};
type Texts = Record<HardwareFigureKey, string>;
type SensorChoice = CurrentSensorKind | "unknown";

const asText = (n: number | null) => (n == null ? "" : String(n));
const asNumber = (s: string): number | null => (s.trim() === "" ? null : Number(s));

const ORIGIN_WORDS: Record<FigureOrigin, string> = { board: "from the board record", typed: "typed by you", unknown: "not known: read it off the part" };

const LABELS: Record<HardwareFigureKey, { name: string; label: string; hint: string }> = {
  dividerTopOhms: { name: "the top resistor", label: "Top resistor R1 (Ω)", hint: "From the pack's + to the ADC pin" },
  dividerBottomOhms: { name: "the bottom resistor", label: "Bottom resistor R2 (Ω)", hint: "From the ADC pin to ground" },
  shuntMilliohms: { name: "the shunt", label: "Shunt (mΩ)", hint: "Often marked R50 = 0.5 mΩ, R25 = 0.25 mΩ" },
  amplifierGain: { name: "the amplifier gain", label: "Amplifier gain (V/V)", hint: "From the amplifier's datasheet or part suffix" },
  hallMvPerAmp: { name: "the Hall sensitivity", label: "Hall sensitivity (mV/A)", hint: "From the sensor's datasheet" },
  adcReferenceVolts: { name: "the ADC reference", label: "ADC reference (V)", hint: "Usually the processor's supply" },
  adcBits: { name: "the ADC resolution", label: "ADC resolution (bits)", hint: "Usually 12" },
  maxCells: { name: "the largest pack", label: "Largest pack (S)", hint: "For the divider's headroom at 4.35 V a cell" },
};

export function HardwareWorksheetForm({ family, quadId, board, fromBoard, published }: Props) {
  const [texts, setTexts] = useState<Texts>(() => Object.fromEntries(HARDWARE_FIGURE_KEYS.map((k) => [k, asText(fromBoard[k])])) as Texts);
  const [sensor, setSensor] = useState<SensorChoice>(fromBoard.currentSensor ?? "unknown");
  const [atAmps, setAtAmps] = useState("");

  const figures: HardwareFigures = useMemo(
    () => ({
      ...(Object.fromEntries(HARDWARE_FIGURE_KEYS.map((k) => [k, asNumber(texts[k])])) as Record<HardwareFigureKey, number | null>),
      currentSensor: sensor === "unknown" ? null : sensor,
    }),
    [texts, sensor],
  );
  // The whole input names every bad field; each part is also worked out on its own so that a
  // half-typed resistor pair does not hide the current scale (and the other way round).
  const { result, voltage, current } = useMemo(() => {
    const input = hardwareWorksheetInput(figures, { published, atAmps: asNumber(atAmps) });
    const part = (keep: boolean, only: Partial<typeof input>) => (keep ? hardwareWorksheet({ ...input, ...only }, family) : null);
    return {
      result: hardwareWorksheet(input, family),
      voltage: part(input.divider != null, { currentSensor: null, atAmps: null }),
      current: part(input.currentSensor != null, { divider: null, maxCells: null }),
    };
  }, [figures, published, atAmps, family]);
  const errors = new Map<string, string[]>();
  if (!result.ok) for (const e of result.errors) errors.set(e.field, [...(errors.get(e.field) ?? []), e.message]);
  const noParts = errors.get("input");
  const warnings = [...new Map([...(voltage?.warnings ?? []), ...(current?.warnings ?? [])].map((w) => [w.field + w.message, w])).values()];

  const field = (key: HardwareFigureKey) => {
    const id = `hw-${key}`;
    const err = errors.get(HARDWARE_FIELD_PATHS[key]);
    const origin = figureOrigin(fromBoard[key], figures[key]);
    const restorable = origin !== "board" && fromBoard[key] != null;
    return (
      <div key={key}>
        <label htmlFor={id} className="mb-1 block font-semibold">
          {LABELS[key].label}
        </label>
        <input
          id={id}
          type="number"
          inputMode="decimal"
          className="sb-field"
          value={texts[key]}
          onChange={(e) => setTexts((t) => ({ ...t, [key]: e.target.value }))}
          aria-invalid={err ? true : undefined}
          aria-describedby={`${id}-origin${err ? ` ${id}-error` : ""}`}
        />
        <p id={`${id}-origin`} className={`mt-1 text-small ${origin === "unknown" ? "font-semibold text-ink" : "text-muted"}`} data-testid={`${id}-origin`}>
          {origin === "unknown" ? "? " : ""}
          {ORIGIN_WORDS[origin]}
          {restorable && (
            <>
              {" · "}
              <button type="button" className="underline" onClick={() => setTexts((t) => ({ ...t, [key]: asText(fromBoard[key]) }))}>
                use the record&rsquo;s {fromBoard[key]}
              </button>
            </>
          )}
        </p>
        <p className="text-small text-muted">{LABELS[key].hint}</p>
        <FieldError id={`${id}-error`} messages={err} />
      </div>
    );
  };

  // only the figures the recorded sensor kind uses: a shunt board is not missing a Hall figure
  const relevant = HARDWARE_FIGURE_KEYS.filter((k) =>
    k === "hallMvPerAmp" ? fromBoard.currentSensor === "hall" : k === "shuntMilliohms" || k === "amplifierGain" ? fromBoard.currentSensor !== "hall" : true,
  );
  const missingFromRecord = [
    ...(fromBoard.currentSensor == null ? ["the current sensor"] : []),
    ...relevant.filter((k) => fromBoard[k] == null).map((k) => LABELS[k].name),
  ];
  const sensorOrigin: FigureOrigin = sensor === "unknown" ? "unknown" : fromBoard.currentSensor === sensor ? "board" : "typed";

  return (
    <div className="space-y-5">
      <p>
        What the parts on the board say the settings should be, before any flight, in {family.name}&rsquo;s units.{" "}
        {board ? (
          <>
            Figures start from Shuntbook&rsquo;s record of{" "}
            <strong>
              {board.name} {board.revisionLabel}
            </strong>
            ;{" "}
          </>
        ) : (
          <>This quad has no board revision set, so there are no recorded figures; </>
        )}
        type what you read off your own board to override them.
      </p>
      {board && missingFromRecord.length > 0 && (
        <p className="text-small" data-testid="hardware-missing">
          <strong>Not in the record:</strong> {missingFromRecord.join(", ")}. Read {missingFromRecord.length === 1 ? "it" : "them"} off the board or its
          datasheet, or leave {missingFromRecord.length === 1 ? "it" : "them"} blank.
        </p>
      )}

      <div className="space-y-4 rounded-md border-2 border-rule bg-surface p-4" data-testid="hardware-form">
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="mb-2 font-display text-lg font-bold tracking-wide uppercase">Voltage divider</legend>
          {field("dividerTopOhms")}
          {field("dividerBottomOhms")}
        </fieldset>

        {/* the rule sits on a wrapper: on a fieldset it would run through the legend */}
        <div className="border-t border-rule pt-3">
          <fieldset className="space-y-3">
            <legend className="mb-2 font-display text-lg font-bold tracking-wide uppercase">Current sensor</legend>
            <div className="flex flex-wrap gap-x-5 gap-y-2" role="radiogroup" aria-label="Current sensor kind" aria-describedby="hw-sensor-origin">
              {(
                [
                  ["shunt", "Shunt and amplifier"],
                  ["hall", "Hall sensor"],
                  ["unknown", "Not known / none on board"],
                ] as const
              ).map(([value, label]) => (
                <label key={value} className="flex items-center gap-2 font-semibold">
                  <input type="radio" name="hw-sensor" value={value} checked={sensor === value} onChange={() => setSensor(value)} className="size-5" /> {label}
                </label>
              ))}
            </div>
            <p id="hw-sensor-origin" className="text-small text-muted">
              Sensor kind {ORIGIN_WORDS[sensorOrigin].replace(": read it off the part", "")}.
              {sensor === "unknown" && " If current comes from a stacked ESC, enter that ESC's sensor here."}
            </p>
            {sensor === "shunt" && (
              <div className="grid gap-3 sm:grid-cols-2">
                {field("shuntMilliohms")}
                {field("amplifierGain")}
              </div>
            )}
            {sensor === "hall" && <div className="grid gap-3 sm:grid-cols-2">{field("hallMvPerAmp")}</div>}
            <FieldError messages={errors.get("currentSensor.kind")} />
          </fieldset>
        </div>

        <div className="border-t border-rule pt-3">
          <fieldset className="grid gap-3 sm:grid-cols-2">
            <legend className="mb-2 font-display text-lg font-bold tracking-wide uppercase">ADC and pack</legend>
            {field("adcReferenceVolts")}
            {field("adcBits")}
            {field("maxCells")}
            <div>
              <label htmlFor="hw-atAmps" className="mb-1 block font-semibold">
                Check at a current (A)
              </label>
              <input
                id="hw-atAmps"
                type="number"
                inputMode="decimal"
                className="sb-field"
                value={atAmps}
                onChange={(e) => setAtAmps(e.target.value)}
                aria-invalid={errors.get("atAmps") ? true : undefined}
              />
              <p className="mt-1 text-small text-muted">Optional: the sensor&rsquo;s output and the shunt&rsquo;s heat at, say, full throttle</p>
              <FieldError messages={errors.get("atAmps")} />
            </div>
          </fieldset>
        </div>
      </div>

      {noParts && (
        <p className="font-semibold" data-testid="hardware-needs-parts">
          {noParts.join(" ")}: enter them above to see the expected settings.
        </p>
      )}

      {!noParts && (
        <div className="space-y-4" data-testid="hardware-result">
          {voltage && !voltage.ok ? (
            <FixFirst what="voltage scale" />
          ) : (
            <VoltageResult v={voltage?.ok ? voltage.value.voltage : null} family={family} published={published.voltageScale} />
          )}
          {current && !current.ok ? (
            <FixFirst what="current scale" />
          ) : (
            <CurrentResult c={current?.ok ? current.value.current : null} family={family} published={published.currentScale} />
          )}
        </div>
      )}

      {warnings.length > 0 && (
        <ul className="space-y-1 rounded-md border-2 border-caution-edge bg-caution p-3 text-small" data-testid="hardware-warnings">
          {warnings.map((w) => (
            <li key={w.field + w.message}>⚠ {w.message}</li>
          ))}
        </ul>
      )}

      <section aria-labelledby="hw-counts" className="space-y-2 rounded-md border-2 border-rule p-4">
        <h2 id="hw-counts" className="font-display text-lg font-bold tracking-wide uppercase">
          What counts is the measurement
        </h2>
        <p className="text-small">
          Parts have tolerances and records can be wrong, so these figures are a starting point and a cross-check, not a calibration. Set the voltage scale with
          a <Link href={`/garage/quads/${quadId}/voltage`}>multimeter check</Link>, and the current scale with a fly-and-recharge worksheet (started on the{" "}
          <Link href={`/garage/quads/${quadId}`}>quad&rsquo;s page</Link>): those measure your own board.
        </p>
      </section>
    </div>
  );
}

const FixFirst = ({ what }: { what: string }) => <p className="font-semibold">The {what} shows once the figures marked ⚠ above are complete.</p>;

const stepWords = (step: number, unit: string) => `in steps of ${step} ${unit}`;

function Compare({
  kind,
  nearest,
  comparison,
  published,
}: {
  kind: "voltage" | "current";
  nearest: number;
  comparison: NonNullable<HardwareWorksheet["voltage"]>["comparison"];
  published: number | null;
}) {
  if (published == null || comparison == null) {
    return <p className="text-small text-muted">Nothing is published for this board revision and firmware family yet, so there is nothing to compare with.</p>;
  }
  const { message } = comparisonVerdict(kind, nearest, comparison);
  const sign = comparison.differencePercent >= 0 ? "+" : "−";
  return (
    <div className="space-y-1">
      <p>
        Shuntbook&rsquo;s published recommended value: <span className="font-mono">{published}</span>, that is{" "}
        <span className="font-mono">
          {sign}
          {formatFigure(Math.abs(comparison.differencePercent), 1)} %
        </span>{" "}
        from the parts.
      </p>
      <p className="text-small" data-testid={`hardware-${kind}-verdict`}>
        {message}
      </p>
    </div>
  );
}

function VoltageResult({ v, family, published }: { v: HardwareWorksheet["voltage"]; family: WorksheetFamily; published: number | null }) {
  if (!v) return <p className="text-small text-muted">No voltage scale from the parts: the divider resistors are not known.</p>;
  return (
    <section aria-labelledby="hw-v" className="space-y-2 rounded-md border-3 border-rule bg-surface p-4">
      <h2 id="hw-v" className="font-display text-heading uppercase">
        Voltage scale
      </h2>
      <p>
        Divider ÷<span className="font-mono">{formatFigure(v.dividerRatio, 3)}</span> gives{" "}
        <strong className="font-mono text-lg" data-testid="hardware-voltage-setting">
          {v.nearestSetting}
        </strong>{" "}
        <span className="text-small text-muted">
          (exact {formatFigure(v.exactSetting, 2)}, {stepWords(family.voltageScaleStep, family.voltageScaleUnit)})
        </span>
      </p>
      {v.headroom && (
        <p className="text-small">
          Reads packs up to <span className="font-mono">{formatFigure(v.headroom.fullScalePackVolts, 1)} V</span>, in steps of{" "}
          <span className="font-mono">{formatFigure(v.headroom.packVoltsPerCount * 1000, 1)} mV</span> at the pack.
          {v.headroom.neededPackVolts != null &&
            (v.headroom.saturates
              ? " A full HV pack of the board's largest size does not fit: see the warning below."
              : ` A full HV pack of the largest size (${formatFigure(v.headroom.neededPackVolts, 2)} V) fits.`)}
        </p>
      )}
      <Compare kind="voltage" nearest={v.nearestSetting} comparison={v.comparison} published={published} />
      <p className="text-small text-muted">How: {v.formula}.</p>
    </section>
  );
}

function CurrentResult({ c, family, published }: { c: HardwareWorksheet["current"]; family: WorksheetFamily; published: number | null }) {
  if (!c) return <p className="text-small text-muted">No current scale from the parts: the current sensor or its figures are not known.</p>;
  return (
    <section aria-labelledby="hw-c" className="space-y-2 rounded-md border-3 border-rule bg-surface p-4">
      <h2 id="hw-c" className="font-display text-heading uppercase">
        Current scale
      </h2>
      <p>
        <span className="font-mono">{formatFigure(c.sensitivityMvPerAmp, 3)} mV/A</span> gives{" "}
        <strong className="font-mono text-lg" data-testid="hardware-current-setting">
          {c.nearestSetting}
        </strong>{" "}
        <span className="text-small text-muted">
          (exact {formatFigure(c.exactSetting, 2)}, {stepWords(family.currentScaleStep, family.currentScaleUnit)})
        </span>
      </p>
      {c.atAmps && (
        <p className="text-small">
          At <span className="font-mono">{c.atAmps.amps} A</span> the sensor puts out{" "}
          <span className="font-mono">{formatFigure(c.atAmps.outputVolts, 3)} V</span>
          {c.atAmps.shuntWatts != null && (
            <>
              {" "}
              and the shunt turns <span className="font-mono">{formatFigure(c.atAmps.shuntWatts, 2)} W</span> into heat
            </>
          )}
          .
        </p>
      )}
      <Compare kind="current" nearest={c.nearestSetting} comparison={c.comparison} published={published} />
      <p className="text-small text-muted">How: {c.formula}.</p>
    </section>
  );
}
