import type { EvidenceUnits } from "@/lib/calibration/evidence";
import { getBoardBySlug } from "@/lib/catalogue/get-board";
import { FirmwareFamily, db, familyUnitFieldsOf } from "@/models";
import type { FamilyRules } from "./schema";

// What the submission pages hand the (client) form: every firmware family with its unit rules, and
// the board when the page already knows it (?board= on /submit, or the submission being edited).

/** A family as the form needs it: its rules for the schema plus what the evidence maths reads. */
export type FamilyOption = FamilyRules & EvidenceUnits & { id: number; slug: string; description: string | null };

/** The board the form is about, in the shape GET /api/v1/boards/{slug} also gives. */
export type ChosenBoard = { slug: string; name: string; minCells: number; maxCells: number; revisions: { id: number; label: string }[] };

export async function listFamilyOptions(): Promise<FamilyOption[]> {
  db();
  const families = await FirmwareFamily.findAll({ order: [["name", "ASC"]] });
  return families.map((f) => ({
    id: f.id,
    slug: f.slug,
    name: f.name,
    description: f.description,
    ...familyUnitFieldsOf(f),
  }));
}

/** The board by slug for the form, or null when there is none. */
export async function chosenBoard(slug: string): Promise<ChosenBoard | null> {
  const b = await getBoardBySlug(slug);
  if (!b) return null;
  return { slug: b.slug, name: b.name, minCells: b.minCells, maxCells: b.maxCells, revisions: b.revisions.map((r) => ({ id: r.id, label: r.label })) };
}
