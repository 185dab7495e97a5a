"use client";

import { useId } from "react";
import type { Selection } from "./selection";

// Revision and firmware family as two native drop-downs side by side: one row on a phone, and one
// tap opens the phone's own chooser. It is a real GET form: without a script "Show values" (in
// <noscript>, so it never takes room on a page that runs one) reloads the page for the choice; with
// one a change switches in place. Navigation only, so no react-hook-form.

/** hint: how many values the choice has, or "none yet". */
export type PickerOption = { value: string; label: string; hint?: string };

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
  const id = useId();
  // label and select side by side, not nested: a nested select's chosen option would join the label's name
  return (
    <div className="min-w-0">
      <label htmlFor={id} className="mb-1 block font-display text-base font-bold tracking-wide text-muted uppercase">
        {label}
      </label>
      <select id={id} name={name} value={value} onChange={(e) => onChange(e.target.value)} className={`sb-field ${name === "revision" ? "font-mono" : ""}`}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.hint ? `${o.label} (${o.hint})` : o.label}
          </option>
        ))}
      </select>
    </div>
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
  return (
    <form
      method="get"
      aria-label="Choose revision and firmware family"
      onSubmit={(e) => e.preventDefault()}
      className="grid grid-cols-2 items-end gap-3 sm:max-w-xl"
    >
      <Choice label="Revision" name="revision" options={revisions} value={selection.revision} onChange={(revision) => onChange({ ...selection, revision })} />
      <Choice label="Firmware family" name="family" options={families} value={selection.family} onChange={(family) => onChange({ ...selection, family })} />
      <noscript>
        <button type="submit" className="sb-button sb-button-quiet col-span-2 justify-self-start">
          Show values
        </button>
      </noscript>
    </form>
  );
}
