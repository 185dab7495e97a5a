import { randomUUID } from "node:crypto";
import { Op, Transaction, type CreationAttributes } from "sequelize";
import { z } from "zod";
import { ApiError, badRequest, notFound } from "@/lib/http/errors";
import { EvidencePhoto, Submission, User, db } from "@/models";
import type { Role } from "@/lib/vocabulary";
import { MAX_PHOTOS_PER_SUBMISSION, MAX_UNATTACHED_PHOTOS_PER_USER } from "./limits";
import { deleteOrphanObject, getObject, putObject } from "./object-store";
import { PHOTO_FIELD, PHOTO_IDS_FIELD, photoUrl, type PhotoSummary } from "./photo-api";
import { sanitisePhoto } from "./photo-image";

// Evidence photos: stored, shown and removed under one visibility rule.
//   - The uploader, moderators and admins may always see a photo (moderators must judge evidence
//     before anything is public); removed photos stay visible to moderators and admins only.
//   - Anyone may see it once its submission is approved: then it backs a published value.
//   - Everyone else gets 404, never 403, so a photo's existence does not leak.

/** Who is asking: the signed-in user (lib/auth's SessionUser fits), or null for a visitor. */
export type PhotoViewer = { id: string; role: Role } | null;

export { photoUrl, type PhotoSummary };

const STAFF: readonly Role[] = ["moderator", "admin"];
const OBJECT_PREFIX = "evidence";
const photoId = z.uuid();

function summary(photo: EvidencePhoto): PhotoSummary {
  return { id: photo.id, width: photo.width, height: photo.height, byteSize: photo.byteSize };
}

function isStaff(viewer: PhotoViewer): boolean {
  return viewer !== null && STAFF.includes(viewer.role);
}

function isPublic(photo: EvidencePhoto): boolean {
  return !photo.deletedAt && photo.submission?.status === "approved";
}

function canView(photo: EvidencePhoto, viewer: PhotoViewer): boolean {
  if (isStaff(viewer) || isPublic(photo)) return true;
  return viewer !== null && viewer.id === photo.uploaderId && !photo.deletedAt;
}

const hidden = () => notFound("There is no photo with this id.", "id");

function tooManyWaiting(waiting: number): ApiError {
  return badRequest({
    [PHOTO_FIELD]: [`You have ${waiting} photos not yet part of a submission (the limit is ${MAX_UNATTACHED_PHOTOS_PER_USER}). Submit or remove some first.`],
  });
}

function countWaiting(uploaderId: string, transaction?: Transaction): Promise<number> {
  return EvidencePhoto.count({ where: { uploaderId, submissionId: null }, transaction });
}

/**
 * Writes the photo's row unless its uploader already holds MAX_UNATTACHED_PHOTOS_PER_USER
 * photos not yet part of a submission. Count and insert are one step per uploader: the uploader's
 * row is locked FOR NO KEY UPDATE first, so concurrent uploads by one person queue here (for a
 * count and an insert, not for the decode) and each counts the others' rows. The lock leaves the
 * row's key alone, so inserts elsewhere that reference the user are not held up.
 */
async function insertWithinCap(values: CreationAttributes<EvidencePhoto> & { uploaderId: string }): Promise<EvidencePhoto> {
  return db().transaction(async (transaction) => {
    await User.findByPk(values.uploaderId, { attributes: ["id"], transaction, lock: transaction.LOCK.NO_KEY_UPDATE });
    const waiting = await countWaiting(values.uploaderId, transaction);
    if (waiting >= MAX_UNATTACHED_PHOTOS_PER_USER) throw tooManyWaiting(waiting);
    return EvidencePhoto.create(values, { transaction });
  });
}

/**
 * Checks, re-encodes (dropping EXIF/GPS) and stores one uploaded photo for `uploaderId`. Every
 * refusal is an ApiError 400 naming the `file` field, and leaves no row and no object behind.
 */
export async function storeEvidencePhoto(uploaderId: string, bytes: Uint8Array): Promise<PhotoSummary> {
  db();
  // a quick answer before the decode for someone already at the cap; insertWithinCap decides
  const waiting = await countWaiting(uploaderId);
  if (waiting >= MAX_UNATTACHED_PHOTOS_PER_USER) throw tooManyWaiting(waiting);
  const image = await sanitisePhoto(bytes);
  const id = randomUUID();
  const objectKey = `${OBJECT_PREFIX}/${id}.${image.extension}`;
  await putObject(objectKey, image.data, image.contentType);
  try {
    const photo = await insertWithinCap({
      id,
      uploaderId,
      submissionId: null,
      objectKey,
      contentType: image.contentType,
      byteSize: image.byteSize,
      width: image.width,
      height: image.height,
      sha256: image.sha256,
    });
    return summary(photo);
  } catch (error) {
    // no row points at the object, so it is not a photo yet: undo the put, keep the store tidy
    await deleteOrphanObject(objectKey).catch(() => undefined);
    throw error;
  }
}

async function loadPhoto(id: string, options: { transaction?: Transaction; lock?: boolean } = {}): Promise<EvidencePhoto | null> {
  if (!photoId.safeParse(id).success) return null;
  db();
  return EvidencePhoto.findByPk(id, {
    paranoid: false,
    include: [{ model: Submission, as: "submission", attributes: ["id", "status"] }],
    transaction: options.transaction,
    // lock the photo row only; the submission is locked separately where it matters
    ...(options.lock && options.transaction ? { lock: { level: options.transaction.LOCK.UPDATE, of: EvidencePhoto } } : {}),
  });
}

export type ViewablePhoto = {
  id: string;
  objectKey: string;
  contentType: string;
  byteSize: number;
  sha256: string;
  /** Visible to anyone (approved submission): the response may be cached publicly. */
  isPublic: boolean;
};

/** A photo the viewer may see (one database read, no object store); ApiError 404 for everyone else. */
export async function findViewablePhoto(id: string, viewer: PhotoViewer): Promise<ViewablePhoto> {
  const photo = await loadPhoto(id);
  if (!photo || !canView(photo, viewer)) throw hidden();
  const { objectKey, contentType, byteSize, sha256 } = photo;
  return { id: photo.id, objectKey, contentType, byteSize, sha256, isPublic: isPublic(photo) };
}

/** The stored bytes of a photo found by findViewablePhoto, as a stream. */
export async function readPhotoObject(photo: ViewablePhoto): Promise<ReadableStream<Uint8Array>> {
  const object = await getObject(photo.objectKey);
  if (!object) {
    console.error(`[photos] ${photo.id}: object ${photo.objectKey} is missing from the store`);
    throw hidden();
  }
  return object.body;
}

/**
 * Soft-deletes a photo for its uploader, while it is not yet part of a submission or its
 * submission still awaits review. Reviewed evidence stays: a published value must keep it.
 */
export async function removeEvidencePhoto(id: string, user: NonNullable<PhotoViewer>): Promise<void> {
  await db().transaction(async (transaction) => {
    const photo = await loadPhoto(id, { transaction, lock: true });
    if (!photo || photo.deletedAt || !canView(photo, user)) throw hidden();
    if (photo.uploaderId !== user.id) throw new ApiError(403, "Only the person who uploaded a photo can remove it.");
    if (photo.submissionId !== null) {
      // share-lock the submission so a moderator cannot approve it while the photo goes
      const submission = await Submission.findByPk(photo.submissionId, { attributes: ["id", "status"], transaction, lock: transaction.LOCK.SHARE });
      if (submission?.status !== "pending") {
        throw new ApiError(409, "This photo belongs to a submission that has been reviewed, so it is kept as its evidence.");
      }
    }
    await photo.destroy({ transaction });
  });
}

/**
 * Makes photos part of a submission, inside the transaction that creates (or edits) it. Each
 * photo must have been uploaded by `userId`, not be removed, and not belong to another
 * submission; photos already on this submission are accepted as they are, so an edit may send
 * its whole list again. Otherwise this throws ApiError 400 naming `photoIds` (and the caller's
 * transaction rolls back). Returns the listed photos.
 */
export async function attachPhotosToSubmission(
  photoIds: readonly string[],
  submissionId: number,
  userId: string,
  transaction: Transaction,
): Promise<PhotoSummary[]> {
  const ids = [...new Set(photoIds)];
  if (ids.length === 0) return [];
  const malformed = ids.filter((id) => !photoId.safeParse(id).success);
  if (malformed.length) throw badRequest({ [PHOTO_IDS_FIELD]: [`Not a photo id: ${malformed.slice(0, 3).join(", ")}.`] });
  db();
  const submission = await Submission.findByPk(submissionId, { attributes: ["id", "contributorId"], transaction });
  if (!submission || submission.contributorId !== userId) {
    // a programming error in the caller, not something a contributor can cause
    throw new Error(`attachPhotosToSubmission: submission ${submissionId} does not belong to user ${userId}`);
  }
  const others = await EvidencePhoto.count({ where: { submissionId, id: { [Op.notIn]: ids } }, transaction });
  if (others + ids.length > MAX_PHOTOS_PER_SUBMISSION) {
    throw badRequest({
      [PHOTO_IDS_FIELD]: [`A submission can have at most ${MAX_PHOTOS_PER_SUBMISSION} photos; remove ${others + ids.length - MAX_PHOTOS_PER_SUBMISSION}.`],
    });
  }
  // the WHERE is the rule; a photo that another transaction attaches first no longer matches
  await EvidencePhoto.update({ submissionId }, { where: { id: { [Op.in]: ids }, uploaderId: userId, submissionId: null, deletedAt: null }, transaction });
  const attached = await EvidencePhoto.findAll({ where: { id: { [Op.in]: ids }, uploaderId: userId, submissionId }, transaction });
  if (attached.length !== ids.length) {
    const missing = ids.length - attached.length;
    throw badRequest({
      [PHOTO_IDS_FIELD]: [
        `${missing === 1 ? "One photo is" : `${missing} photos are`} no longer available (removed, already part of another submission, or uploaded by someone else). Remove ${missing === 1 ? "it" : "them"} from the form and upload again.`,
      ],
    });
  }
  return ids.map((id) => summary(attached.find((p) => p.id === id)!));
}

/** A submission's photos (not removed), oldest first, for its page and the review queue. */
export async function listSubmissionPhotos(submissionId: number, transaction?: Transaction): Promise<PhotoSummary[]> {
  db();
  const photos = await EvidencePhoto.findAll({
    where: { submissionId },
    order: [
      ["createdAt", "ASC"],
      ["id", "ASC"],
    ],
    transaction,
  });
  return photos.map(summary);
}
