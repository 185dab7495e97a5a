import { boardDetailResponse } from "@/lib/api/boards-response";
import { notFound } from "@/lib/api/errors";
import { apiRoute, readOnly } from "@/lib/api/handler";
import { jsonOk } from "@/lib/api/respond";
import type { BoardDetailResponse } from "@/lib/api/schemas/boards";
import { getBoardBySlug } from "@/lib/catalogue/get-board";

type Context = { params: Promise<{ slug: string }> };

// GET /api/v1/boards/{slug}: one board with its revisions' sensor hardware.
export const GET = apiRoute<Context>(async (request, { params }) => {
  const { slug } = await params;
  const board = await getBoardBySlug(slug);
  if (!board) throw notFound(`No board has the slug "${slug}".`, "slug");
  return jsonOk<BoardDetailResponse>(request, boardDetailResponse(board));
});

export const POST = readOnly();
export const PUT = readOnly();
export const PATCH = readOnly();
export const DELETE = readOnly();
