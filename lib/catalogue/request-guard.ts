import { queryRecord } from "@/lib/api/query";
import { parseCatalogueParams } from "./search-params";

/**
 * For the root proxy.ts: true when a /boards request carries parameters the catalogue rejects.
 * A page component cannot set a 400 status in the App Router, so the proxy answers the same URL
 * through NextResponse.rewrite(url, { status: 400 }) and the page renders its field-level errors
 * (app/boards/page.tsx → components/param-errors.tsx) under that status.
 */
export function hasBadCatalogueParams(request: Request): boolean {
  return !parseCatalogueParams(queryRecord(request)).ok;
}
