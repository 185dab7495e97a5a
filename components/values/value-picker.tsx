"use client";

import { useSyncExternalStore } from "react";
import type { Selection } from "./selection";

// Revision and firmware family as two rows of radio chips. It is a real GET form: before the
// script runs (or without it) "Show values" reloads the page for the choice; once hydrated a
// change switches in place and the button goes away. Navigation only, so no react-hook-form.

export type PickerOption = { value: string; label: string; hint?: string };

const noop = () => () => {};
const useHydrated = () =>
  useSyncExternalStore(
    noop,
    () => true,
    () => false,
  );

function ChipGroup({
  legend,
  name,
  options,
  value,
  onChange,
}: {
  legend: string;
  name: keyof Selection;
  options: PickerOption[];
  value: string;
  onChange: (value: string) => void;
}) {
  return (
    <fieldset className="min-w-0">
      <legend className="mb-1 font-display text-base font-bold tracking-wide text-muted uppercase">{legend}</legend>
      <div className="flex flex-wrap gap-2">
        {options.map((o) => (
          <label key={o.value} className="relative">
            <input
              type="radio"
              name={name}
              value={o.value}
              checked={o.value === value}
              onChange={() => onChange(o.value)}
              className="peer absolute inset-0 z-10 cursor-pointer opacity-0"
            />
            <span className="inline-flex min-h-11 items-center gap-2 rounded-md border-2 border-rule bg-surface px-3 font-semibold peer-checked:border-ink peer-checked:bg-ink peer-checked:text-paper peer-hover:bg-sunken peer-checked:peer-hover:bg-ink peer-focus-visible:shadow-[0_0_0_3px_var(--sb-paper),0_0_0_7px_var(--sb-signal)]">
              <span className={name === "revision" ? "font-mono" : ""}>{o.label}</span>
              {o.hint && <span className="text-small font-normal opacity-80">{o.hint}</span>}
            </span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

export function ValuePicker({
  selection,
  revisions,
  families,
  onChange,
}: {
  selection: Selection;
  revisions: PickerOption[];
  families: PickerOption[];
  onChange: (next: Selection) => void;
}) {
  const hydrated = useHydrated();
  return (
    <form
      method="get"
      aria-label="Choose revision and firmware family"
      onSubmit={(e) => e.preventDefault()}
      className="flex flex-col gap-3 sm:flex-row sm:flex-wrap sm:items-end sm:gap-6"
    >
      <ChipGroup
        legend="Revision"
        name="revision"
        options={revisions}
        value={selection.revision}
        onChange={(revision) => onChange({ ...selection, revision })}
      />
      <ChipGroup legend="Firmware family" name="family" options={families} value={selection.family} onChange={(family) => onChange({ ...selection, family })} />
      {!hydrated && (
        <button type="submit" className="sb-button sb-button-quiet self-start">
          Show values
        </button>
      )}
    </form>
  );
}
