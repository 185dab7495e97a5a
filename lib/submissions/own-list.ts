import { fn, col } from "sequelize";
import { z } from "zod";
import { pageParam, pageSizeParam, parseQuery, type QueryResult } from "@/lib/http/query";
import { STATUSES, type SubmissionStatus } from "@/lib/vocabulary";
import { Submission, db } from "@/models";
import { loadOwnPage, type SubmissionView } from "./view";

// "My submissions" and GET /api/v1/submissions: the contributor's own submissions, newest first,
// one status at a time if asked, a page at a time (a long-time contributor's 25 cards were 12,800 px
// on a phone). Plans: the page comes from submissions_contributor_status_created_idx (or
// submissions_contributor_created_idx without a status), the counts from the same index.

export const OWN_LIST_PAGE_SIZE = 10;
const OWN_LIST_MAX_PAGE_SIZE = 50;

/** The query string's parameters, one schema for the page and the API. */
export const OwnListQuerySchema = z.object({
  status: z
    .enum(STATUSES, { error: `status is one of: ${STATUSES.join(", ")}` })
    .nullable()
    .default(null),
  page: pageParam(),
  pageSize: pageSizeParam(OWN_LIST_MAX_PAGE_SIZE, OWN_LIST_PAGE_SIZE),
});
export type OwnListQuery = z.output<typeof OwnListQuerySchema>;

/** The page's parse of its query string: the parameters, or field errors naming each bad one. */
export const parseOwnListQuery = (input: Record<string, string | string[] | undefined>): QueryResult<OwnListQuery> => parseQuery(OwnListQuerySchema, input);

export type OwnListPage = {
  submissions: SubmissionView[];
  status: SubmissionStatus | null;
  page: number;
  pageSize: number;
  /** Submissions under the status filter, over all pages. */
  total: number;
  pageCount: number;
  /** The contributor's submissions per status (and all), for the filter's badges. */
  counts: Record<SubmissionStatus | "all", number>;
};

async function countsByStatus(contributorId: string): Promise<OwnListPage["counts"]> {
  db();
  const rows = (await Submission.findAll({
    attributes: ["status", [fn("count", col("id")), "n"]],
    where: { contributorId },
    group: ["status"],
    raw: true,
  })) as unknown as { status: SubmissionStatus; n: string }[];
  const counts = Object.fromEntries([...STATUSES, "all"].map((s) => [s, 0])) as OwnListPage["counts"];
  for (const r of rows) {
    counts[r.status] = Number(r.n);
    counts.all += Number(r.n);
  }
  return counts;
}

/** One page of the contributor's own submissions, newest first. */
export async function listOwnSubmissions(contributorId: string, query: OwnListQuery = OwnListQuerySchema.parse({})): Promise<OwnListPage> {
  const counts = await countsByStatus(contributorId);
  const total = query.status ? counts[query.status] : counts.all;
  const pageCount = Math.max(1, Math.ceil(total / query.pageSize));
  const submissions = await loadOwnPage(contributorId, query.status, query.pageSize, (query.page - 1) * query.pageSize);
  return { submissions, status: query.status, page: query.page, pageSize: query.pageSize, total, pageCount, counts };
}
