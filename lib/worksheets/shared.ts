import type { Transaction } from "sequelize";
import { ApiError, badRequest } from "@/lib/http/errors";
import { settingField, type SettingKind, type WorksheetFamily } from "@/lib/calibration/fields";
import type { FieldIssue } from "@/lib/calibration";
import { notYours } from "@/lib/garage/owned";
import { getBoardValues } from "@/lib/published/board-values";
import { BoardModel, BoardRevision, db, FirmwareFamily, Quad, Worksheet, WorksheetBenchPoint, WorksheetStep, WorksheetVoltageReading } from "@/models";

// What every kind of worksheet shares: the caller's own worksheet (locked inside a transaction),
// the quad it is started on with its family and revision, the board's published setting as the
// starting point; about its saved iterations, readings and points: the rows in order (live and
// taken back), taking back the last one, the field errors of a refused one, and the check of a
// setting in force at the start.

/** The quad a worksheet starts on, with the family whose rules it follows and the revision it is filed under. */
export async function quadContext(ownerId: string, quadId: number, setting = "current-scale") {
  db();
  const quad = await Quad.findOne({ where: { id: quadId, ownerId } });
  if (!quad) throw notYours("quad");
  if (!quad.firmwareFamilyId) throw badRequest({ quadId: [`Give this quad its firmware family first: the worksheet follows that family's ${setting} rules`] });
  if (!quad.boardRevisionId)
    throw badRequest({
      quadId: ["Give this quad its board revision first: its published value is the worksheet's starting point and the result is filed under it"],
    });
  const family = (await FirmwareFamily.findByPk(quad.firmwareFamilyId))!;
  const revision = (await BoardRevision.findByPk(quad.boardRevisionId, { include: [{ model: BoardModel, as: "boardModel" }] })) as BoardRevision & {
    boardModel: BoardModel;
  };
  return { quad, family, revision };
}

/** The board's published recommended setting for this revision and family, or null. */
export async function publishedSetting(
  boardSlug: string,
  revisionLabel: string,
  familySlug: string,
  key: "currentScale" | "voltageScale" | "currentOffset",
): Promise<number | null> {
  const selected = await getBoardValues(boardSlug, { revision: revisionLabel, family: familySlug });
  if (!selected?.ok) return null;
  return selected.values.revisions[0]?.families[0]?.[key]?.recommended.setting ?? null;
}

/** The caller's worksheet of any kind (row-locked inside a transaction), or the 404 of someone else's. */
export async function ownSheet(ownerId: string, id: number, transaction?: Transaction) {
  db();
  const sheet = await Worksheet.findOne({ where: { id, ownerId }, transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!sheet) throw notYours("worksheet");
  return sheet;
}

type EntryModel = typeof WorksheetVoltageReading | typeof WorksheetBenchPoint | typeof WorksheetStep;
type Entry = WorksheetVoltageReading | WorksheetBenchPoint | WorksheetStep;

/** Every row of the worksheet in position order: the live ones, and the ones taken back. */
export async function entriesOf<R extends Entry>(model: EntryModel, worksheetId: number, transaction?: Transaction): Promise<{ live: R[]; removed: R[] }> {
  const rows = (await (model as typeof WorksheetVoltageReading).findAll({
    where: { worksheetId },
    order: [
      ["position", "ASC"],
      ["id", "ASC"],
    ],
    transaction,
  })) as unknown as R[];
  return { live: rows.filter((r) => r.removedAt == null), removed: rows.filter((r) => r.removedAt != null) };
}

/** Refuses a change to a published worksheet: its readings are a submission's evidence now. */
export function assertOpen(sheet: Worksheet, what: string): void {
  if (sheet.submissionId != null)
    throw new ApiError(409, `This worksheet is published; its ${what} are the submission's evidence. Start a new worksheet to measure again.`);
}

/**
 * Takes back the last live row: it stays in the table with removed_at set (shown struck out, never
 * counted or published), so a mistyped reading is never silently lost. The caller names the
 * position it means, so a double tap cannot take back two.
 */
async function removeLastEntry<R extends Entry>(model: EntryModel, sheet: Worksheet, position: number, noun: string, transaction: Transaction): Promise<R> {
  const { live } = await entriesOf<R>(model, sheet.id, transaction);
  const last = live.at(-1);
  if (!last) throw new ApiError(409, `This worksheet has no ${noun} to take back.`);
  if (last.position !== position) {
    throw new ApiError(409, `Only the last ${noun} can be taken back: that is ${noun} ${last.position + 1}.`, {
      position: [`Take back ${noun} ${last.position + 1} first`],
    });
  }
  await (last as WorksheetVoltageReading).update({ removedAt: new Date() }, { transaction });
  return last;
}

/**
 * The whole take-back of one worksheet kind, in one transaction: `own` finds (and locks) the
 * caller's worksheet of that kind, which must still be open; its last live row is taken back and
 * the worksheet marked as changed. Returns the row taken back.
 */
export function takeBackLast<R extends Entry>(
  own: (transaction: Transaction) => Promise<Worksheet>,
  model: EntryModel,
  position: number,
  noun: string,
): Promise<R> {
  return db().transaction(async (transaction) => {
    const sheet = await own(transaction);
    assertOpen(sheet, `${noun}s`);
    const row = await removeLastEntry<R>(model, sheet, position, noun, transaction);
    await sheet.update({ updatedAt: new Date() }, { transaction });
    return row;
  });
}

/** The pure worksheet's errors about the new row under its own field names ("readings.3.cells" → "cells"). */
export function newEntryErrors(errors: FieldIssue[], prefix: string): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const e of errors) {
    const key = e.field.startsWith(prefix) ? e.field.slice(prefix.length) : e.field;
    (fields[key] ??= []).push(e.message);
  }
  return fields;
}

/** The setting in force, checked against the family's range before the worksheet is started. */
export function checkSetting(value: number, label: string, family: WorksheetFamily, kind: SettingKind, field: string): void {
  const parsed = settingField(label, family, kind).safeParse(value);
  if (!parsed.success) throw badRequest({ [field]: parsed.error.issues.map((i) => i.message) });
}

/** A position from the path: a whole number from 0, or 404 (it can name no row). */
export function positionFrom(raw: string): number {
  const n = Number(raw);
  if (!Number.isSafeInteger(n) || n < 0) throw new ApiError(404, "No such reading in this worksheet.");
  return n;
}
