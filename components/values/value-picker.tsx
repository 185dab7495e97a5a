"use client";

import { useSyncExternalStore } from "react";
import type { Selection } from "./selection";

// Revision and firmware family as two native drop-downs side by side: one row on a phone, and one
// tap opens the phone's own chooser. It is a real GET form: before the script runs (or without it)
// "Show values" reloads the page for the choice; once hydrated a change switches in place and the
// button goes away. Navigation only, so no react-hook-form.

/** hint: how many values the choice has, or "none yet". */
export type PickerOption = { value: string; label: string; hint?: string };

const noop = () => () => {};
const useHydrated = () =>
  useSyncExternalStore(
    noop,
    () => true,
    () => false,
  );

function Choice({
  label,
  name,
  options,
  value,
  onChange,
}: {
  label: string;
  name: keyof Selection;
  options: PickerOption[];
  value: string;
  onChange: (value: string) => void;
}) {
  return (
    <label className="block min-w-0">
      <span className="mb-1 block font-display text-base font-bold tracking-wide text-muted uppercase">{label}</span>
      <select name={name} value={value} onChange={(e) => onChange(e.target.value)} className={`sb-field ${name === "revision" ? "font-mono" : ""}`}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.hint ? `${o.label} (${o.hint})` : o.label}
          </option>
        ))}
      </select>
    </label>
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
      className="grid grid-cols-2 items-end gap-3 sm:max-w-xl"
    >
      <Choice label="Revision" name="revision" options={revisions} value={selection.revision} onChange={(revision) => onChange({ ...selection, revision })} />
      <Choice label="Firmware family" name="family" options={families} value={selection.family} onChange={(family) => onChange({ ...selection, family })} />
      {!hydrated && (
        <button type="submit" className="sb-button sb-button-quiet col-span-2 justify-self-start">
          Show values
        </button>
      )}
    </form>
  );
}
