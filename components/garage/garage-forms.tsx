"use client";

import { CHEMISTRIES, CHEMISTRY_LIMITS } from "@/lib/calibration/chemistry";
import { chargeInput, packInput, quadInput } from "@/lib/garage/schemas";
import { GarageForm } from "./garage-form";

// The three garage forms, each with the server's own zod schema.

export type Choice = { value: string; label: string };

export function QuadForm({ revisions, families }: { revisions: Choice[]; families: Choice[] }) {
  return (
    <GarageForm
      title="Add a quad"
      action="/api/v1/garage/quads"
      schema={quadInput}
      submitLabel="Save quad"
      testId="quad-form"
      fields={[
        { name: "name", label: "Name" },
        {
          name: "boardRevisionId",
          label: "Board revision",
          type: "select",
          options: [{ value: "", label: "Not listed / not chosen" }, ...revisions],
          hint: "Its published values give a worksheet its starting point.",
        },
        { name: "firmwareFamilyId", label: "Firmware family", type: "select", options: [{ value: "", label: "Not chosen" }, ...families] },
        { name: "firmwareVersion", label: "Firmware version" },
        { name: "esc", label: "ESC" },
        { name: "notes", label: "Notes", type: "textarea" },
      ]}
    />
  );
}

export function PackForm() {
  return (
    <GarageForm
      title="Add a pack"
      action="/api/v1/garage/packs"
      schema={packInput}
      submitLabel="Save pack"
      testId="pack-form"
      fields={[
        { name: "label", label: "Label", hint: "What is written on it, e.g. “Red 3”" },
        {
          name: "chemistry",
          label: "Chemistry",
          type: "select",
          defaultValue: "lipo",
          options: CHEMISTRIES.map((c) => ({ value: c, label: CHEMISTRY_LIMITS[c].label })),
        },
        { name: "cells", label: "Cells (S)", type: "number", step: "1" },
        { name: "ratedMah", label: "Rated mAh", type: "number", step: "1" },
        { name: "purchasedOn", label: "Purchase date", type: "date" },
      ]}
    />
  );
}

export function ChargeForm({ packId, today }: { packId: number; today: string }) {
  return (
    <GarageForm
      title="Log a charge"
      action={`/api/v1/garage/packs/${packId}/charges`}
      schema={chargeInput}
      submitLabel="Log charge"
      testId={`charge-form-${packId}`}
      fields={[
        { name: "chargedOn", label: "Date", type: "date", defaultValue: today },
        { name: "chargedMah", label: "mAh put in", type: "number", step: "1", hint: "As the charger reports it at the end" },
        { name: "restingVoltsPerCell", label: "Resting V per cell", type: "number", step: "0.01", hint: "Per cell, not the whole pack" },
        { name: "afterFullFlight", label: "Flown to the landing voltage before this charge", type: "checkbox", defaultValue: true },
      ]}
    />
  );
}
