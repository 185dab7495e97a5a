import { QueryTypes } from "sequelize";
import { db } from "@/models";

/**
 * The mounting patterns that boards in the catalogue actually use, smallest first, for the
 * filter's choices. (Any well-formed pattern is still accepted in the URL.)
 */
export async function listMountingPatterns(): Promise<string[]> {
  const rows = await db().query<{ mountingPattern: string }>(
    `SELECT DISTINCT mounting_pattern AS "mountingPattern",
            split_part(mounting_pattern, 'x', 1)::numeric AS w,
            split_part(mounting_pattern, 'x', 2)::numeric AS h
       FROM board_models
      ORDER BY w, h`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.mountingPattern);
}
