import type { Transaction } from "sequelize";
import { ApiError, badRequest } from "@/lib/http/errors";
import { createSubmission, type SubmissionView } from "@/lib/submissions";
import { db, Quad, Worksheet } from "@/models";
import { benchSubmissionBody, getBenchWorksheet } from "./bench";
import { getRechargeWorksheet, rechargeSubmissionBody } from "./recharge";
import { ownSheet } from "./shared";
import { getVoltageWorksheet, voltageSubmissionBody } from "./voltage";

// "Publish to Shuntbook" for every kind of worksheet: the worksheet becomes an ordinary pending
// submission (lib/submissions' own create, so the same validation, evidence verdict, trust rule
// and "received" mail), with its readings as evidence, and the worksheet is linked to it, all in
// ONE transaction. The worksheet row is locked first, so a second publish — a double tap, another
// phone — waits, then finds the link and gets 409; if anything fails, no submission remains.

export type PublishOptions = { firmwareVersion?: string | null; notes?: string | null };

export async function publishWorksheet(ownerId: string, id: number, opts: PublishOptions = {}): Promise<SubmissionView> {
  return db().transaction(async (transaction) => {
    const sheet = await ownSheet(ownerId, id, transaction);
    if (sheet.submissionId != null) throw new ApiError(409, "This worksheet is already published.");
    const quad = (await Quad.findByPk(sheet.quadId, { transaction }))!;
    // an unfinished worksheet is refused here, before the version is asked for
    const build = await bodyBuilder(ownerId, sheet, quad, transaction);
    const version = opts.firmwareVersion ?? quad.firmwareVersion;
    if (!version) throw badRequest({ firmwareVersion: ["Enter the firmware version the quad runs (or add it to the quad)"] });
    const created = await createSubmission({ id: ownerId }, build({ firmwareVersion: version, notes: opts.notes }), { transaction });
    await linkSubmission(id, created.body.submission.id, transaction);
    return created.body.submission;
  });
}

/** The worksheet computed inside the transaction, as its submission body for a firmware version; 400 when unfinished. */
async function bodyBuilder(ownerId: string, sheet: Worksheet, quad: Quad, transaction: Transaction) {
  if (sheet.kind === "voltage") return voltageSubmissionBody(await getVoltageWorksheet(ownerId, sheet.id, transaction), quad, sheet.firmwareFamilyId);
  if (sheet.kind === "bench") return benchSubmissionBody(await getBenchWorksheet(ownerId, sheet.id, transaction), quad, sheet.firmwareFamilyId);
  return rechargeSubmissionBody(await getRechargeWorksheet(ownerId, sheet.id, transaction), quad, sheet.firmwareFamilyId);
}

async function linkSubmission(id: number, submissionId: number, transaction: Transaction): Promise<void> {
  const [linked] = await Worksheet.update({ submissionId }, { where: { id, submissionId: null }, transaction });
  // cannot happen under the row lock; if it ever did, the throw rolls the submission back with it
  if (linked !== 1) throw new ApiError(409, "This worksheet is already published.");
}
