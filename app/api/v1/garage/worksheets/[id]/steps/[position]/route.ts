import { z } from "zod";
import { privateJson, route, routes } from "@/lib/http";
import { ownedId } from "@/lib/garage/owned";
import { removeWorksheetEntry } from "@/lib/worksheets";
import { positionFrom } from "@/lib/worksheets/shared";

// Take back the last iteration, voltage reading or bench point of an unpublished worksheet (position counts
// from 0 and must be the last one). The row is kept, marked as taken back; the answer carries it.
const StepParams = z.object({ id: ownedId("worksheet"), position: z.string() });

export const { GET, POST, PUT, PATCH, DELETE } = routes({
  DELETE: route({ auth: "user", params: StepParams }, async ({ user, params }) => {
    const { worksheet, removed } = await removeWorksheetEntry(user.id, params.id, positionFrom(params.position));
    return privateJson({ worksheet, removed });
  }),
});
