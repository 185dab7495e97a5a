"use client";

import { CHEMISTRIES, CHEMISTRY_LIMITS } from "@/lib/calibration/chemistry";
import type { PackView } from "@/lib/garage/packs";
import type { QuadView } from "@/lib/garage/quads";
import { chargeInputFor, isOverCapacity, OVER_CAPACITY_FACTOR, packInput, quadInput } from "@/lib/garage/schemas";
import type { ChosenBoard } from "@/lib/submissions/form-data";
import { GarageForm, type Values } from "./garage-form";

// The three garage forms, each with the server's own zod schema. Each adds a row, or, given the
// row, corrects it (PUT) with its values filled in.

export type Choice = { value: string; label: string };

const text = (v: string | number | null | undefined) => (v == null ? undefined : String(v));

export function QuadForm({ families, quad, board }: { families: Choice[]; quad?: QuadView; board: ChosenBoard | null }) {
  // a board preselected by /garage?board=… with a single revision starts with that revision chosen
  const revision = quad?.boardRevisionId ?? (board?.revisions.length === 1 ? board.revisions[0].id : null);
  return (
    <GarageForm
      title={quad ? `Edit ${quad.name}` : "Add a quad"}
      action={quad ? `/api/v1/garage/quads/${quad.id}` : "/api/v1/garage/quads"}
      method={quad ? "PUT" : "POST"}
      schema={quadInput}
      submitLabel={quad ? "Save changes" : "Save quad"}
      testId={quad ? `quad-edit-${quad.id}` : "quad-form"}
      fields={[
        { name: "name", label: "Name", defaultValue: text(quad?.name) },
        { name: "boardRevisionId", label: "Board", type: "board", board, defaultValue: text(revision) ?? "" },
        {
          name: "firmwareFamilyId",
          label: "Firmware family",
          type: "select",
          options: [{ value: "", label: "Not chosen" }, ...families],
          defaultValue: text(quad?.firmwareFamilyId) ?? "",
        },
        { name: "firmwareVersion", label: "Firmware version", defaultValue: text(quad?.firmwareVersion) },
        { name: "esc", label: "ESC", defaultValue: text(quad?.esc) },
        { name: "notes", label: "Notes", type: "textarea", defaultValue: text(quad?.notes) },
      ]}
    />
  );
}

export function PackForm({ pack }: { pack?: PackView }) {
  return (
    <GarageForm
      title={pack ? `Edit ${pack.label}` : "Add a pack"}
      action={pack ? `/api/v1/garage/packs/${pack.id}` : "/api/v1/garage/packs"}
      method={pack ? "PUT" : "POST"}
      schema={packInput}
      submitLabel={pack ? "Save changes" : "Save pack"}
      testId={pack ? `pack-edit-${pack.id}` : "pack-form"}
      fields={[
        { name: "label", label: "Label", hint: "What is written on it, e.g. “Red 3”", defaultValue: text(pack?.label) },
        {
          name: "chemistry",
          label: "Chemistry",
          type: "select",
          defaultValue: pack?.chemistry ?? "lipo",
          options: CHEMISTRIES.map((c) => ({ value: c, label: CHEMISTRY_LIMITS[c].label })),
        },
        { name: "cells", label: "Cells (S)", type: "number", step: "1", defaultValue: text(pack?.cells) },
        { name: "ratedMah", label: "Rated mAh", type: "number", step: "1", defaultValue: text(pack?.ratedMah) },
        { name: "purchasedOn", label: "Purchase date", type: "date", defaultValue: text(pack?.purchasedOn) },
      ]}
    />
  );
}

type Charge = PackView["charges"][number];

export function ChargeForm({ pack, charge, today }: { pack: Pick<PackView, "id" | "ratedMah" | "purchasedOn">; charge?: Charge; today: string }) {
  const over = (v: Values) => isOverCapacity(Number(v.chargedMah), pack.ratedMah);
  return (
    <GarageForm
      title={charge ? "Correct this charge" : "Log a charge"}
      action={charge ? `/api/v1/garage/packs/${pack.id}/charges/${charge.id}` : `/api/v1/garage/packs/${pack.id}/charges`}
      method={charge ? "PUT" : "POST"}
      schema={chargeInputFor(pack)}
      submitLabel={charge ? "Save changes" : "Log charge"}
      testId={charge ? `charge-edit-${charge.id}` : `charge-form-${pack.id}`}
      fields={[
        { name: "chargedOn", label: "Date", type: "date", defaultValue: charge?.chargedOn ?? today },
        {
          name: "chargedMah",
          label: "mAh put in",
          type: "number",
          step: "1",
          hint: "As the charger reports it at the end",
          defaultValue: text(charge?.chargedMah),
        },
        {
          name: "restingVoltsPerCell",
          label: "Resting V per cell",
          type: "number",
          step: "0.01",
          hint: "Per cell, not the whole pack",
          defaultValue: text(charge?.restingVoltsPerCell),
        },
        {
          name: "afterFullFlight",
          label: "Flown to the landing voltage before this charge",
          type: "checkbox",
          defaultValue: charge?.afterFullFlight ?? true,
        },
        {
          name: "confirmOverCapacity",
          label: "Yes, this is right",
          type: "checkbox",
          showWhen: over,
          warning: (v) =>
            `${v.chargedMah} mAh is more than ${OVER_CAPACITY_FACTOR * 100} % of this pack's rated ${pack.ratedMah} mAh. A pack takes back about what was flown out of it; check the charger's figure for a typo.`,
        },
      ]}
    />
  );
}
