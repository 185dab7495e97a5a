import { QueryTypes } from "sequelize";
import { badRequest } from "@/lib/http/errors";
import { db } from "@/models";
import { WORKSHEET_KINDS, type WorksheetKind } from "@/lib/vocabulary";
import { addBenchPoint, getBenchWorksheet, removeBenchPoint, startBenchWorksheet } from "./bench";
import { addRechargeStep, getRechargeWorksheet, removeRechargeStep, startRechargeWorksheet } from "./recharge";
import { ownSheet } from "./shared";
import { addVoltageReading, getVoltageWorksheet, removeVoltageReading, startVoltageWorksheet } from "./voltage";

// Public face of lib/worksheets: the routes under /api/v1/garage/worksheets and the garage pages
// speak to every kind through these, and each kind's module does its own work.
export { publishWorksheet } from "./publish";

export type AnyWorksheetView =
  Awaited<ReturnType<typeof getRechargeWorksheet>> | Awaited<ReturnType<typeof getVoltageWorksheet>> | Awaited<ReturnType<typeof getBenchWorksheet>>;

const isKind = (v: unknown): v is WorksheetKind => typeof v === "string" && (WORKSHEET_KINDS as readonly string[]).includes(v);

/** Starts a worksheet of the body's `kind` (fly_recharge when none is given, as before kinds existed). */
export async function startWorksheet(ownerId: string, input: unknown): Promise<AnyWorksheetView> {
  const kind = input !== null && typeof input === "object" && !Array.isArray(input) ? ((input as { kind?: unknown }).kind ?? "fly_recharge") : "fly_recharge";
  if (!isKind(kind)) throw badRequest({ kind: ["A worksheet is one of: fly_recharge, voltage, bench"] });
  if (kind === "voltage") return startVoltageWorksheet(ownerId, input);
  if (kind === "bench") return startBenchWorksheet(ownerId, input);
  return startRechargeWorksheet(ownerId, input);
}

export async function getWorksheet(ownerId: string, id: number): Promise<AnyWorksheetView> {
  const { kind } = await ownSheet(ownerId, id);
  if (kind === "voltage") return getVoltageWorksheet(ownerId, id);
  if (kind === "bench") return getBenchWorksheet(ownerId, id);
  return getRechargeWorksheet(ownerId, id);
}

/** Adds one iteration, reading or point, whichever the worksheet takes. */
export async function addWorksheetEntry(ownerId: string, id: number, input: unknown): Promise<AnyWorksheetView> {
  const { kind } = await ownSheet(ownerId, id);
  if (kind === "voltage") return addVoltageReading(ownerId, id, input);
  if (kind === "bench") return addBenchPoint(ownerId, id, input);
  return addRechargeStep(ownerId, id, input);
}

/** Takes back the last reading or point. Fly-and-recharge iterations are kept as they are. */
export async function removeWorksheetEntry(ownerId: string, id: number, position: number) {
  const { kind } = await ownSheet(ownerId, id);
  if (kind === "voltage") return removeVoltageReading(ownerId, id, position);
  if (kind === "bench") return removeBenchPoint(ownerId, id, position);
  return removeRechargeStep(ownerId, id, position);
}

export type WorksheetListItem = { id: number; kind: WorksheetKind; entries: number; submissionId: number | null; createdAt: string; updatedAt: string };

/** Every worksheet of the owner's quad, newest first, with how many iterations, readings or points it holds. */
export async function listQuadWorksheets(ownerId: string, quadId: number): Promise<WorksheetListItem[]> {
  // worksheets_quad_created_idx, and each count through its table's (worksheet_id, position) index
  const rows = await db().query<{ id: number; kind: WorksheetKind; entries: number; submissionId: number | null; createdAt: Date; updatedAt: Date }>(
    `SELECT w.id, w.kind, w.submission_id AS "submissionId", w.created_at AS "createdAt", w.updated_at AS "updatedAt",
            CASE w.kind
              WHEN 'voltage' THEN (SELECT count(*) FROM worksheet_voltage_readings r WHERE r.worksheet_id = w.id AND r.removed_at IS NULL)
              WHEN 'bench' THEN (SELECT count(*) FROM worksheet_bench_points p WHERE p.worksheet_id = w.id AND p.removed_at IS NULL)
              ELSE (SELECT count(*) FROM worksheet_steps s WHERE s.worksheet_id = w.id AND s.removed_at IS NULL)
            END::int AS entries
       FROM worksheets w
      WHERE w.quad_id = $1 AND w.owner_id = $2
      ORDER BY w.created_at DESC, w.id DESC`,
    { bind: [quadId, ownerId], type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ ...r, createdAt: new Date(r.createdAt).toISOString(), updatedAt: new Date(r.updatedAt).toISOString() }));
}

/** The newest unpublished worksheet of a kind on the owner's quad: where a builder picks up at the field. */
export async function openWorksheetId(ownerId: string, quadId: number, kind: WorksheetKind): Promise<number | null> {
  const [row] = await db().query<{ id: number }>(
    "SELECT id FROM worksheets WHERE quad_id = $1 AND owner_id = $2 AND kind = $3 AND submission_id IS NULL ORDER BY created_at DESC, id DESC LIMIT 1",
    { bind: [quadId, ownerId, kind], type: QueryTypes.SELECT },
  );
  return row?.id ?? null;
}
