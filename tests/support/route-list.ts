import { readdirSync } from "node:fs";
import { join, relative } from "node:path";
import type { RouteHandler, RouteSpec } from "@/lib/http/route";

// Every method of every route file under app/api/v1 that route() made, with the spec it declared
// (auth, params, body): the fuzz and authorisation-matrix tests are generated from this list, so a
// new endpoint is covered the day it is added.

const API_DIR = join(process.cwd(), "app/api/v1");
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
type Method = (typeof METHODS)[number];

export type ListedRoute = {
  /** "/api/v1/garage/packs/[id]/charges" */
  template: string;
  method: Method;
  spec: RouteSpec;
  handler: RouteHandler;
  /** the path segments' names, in order ("id", "chargeId") */
  paramNames: string[];
};

function routeFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return routeFiles(path);
    return entry.name === "route.ts" ? [relative(API_DIR, path)] : [];
  });
}

export async function listRoutes(): Promise<ListedRoute[]> {
  const out: ListedRoute[] = [];
  for (const file of routeFiles(API_DIR).sort()) {
    if (file.startsWith("[...path]")) continue; // the catch-all JSON 404
    const mod = (await import(/* @vite-ignore */ `@/app/api/v1/${file.replace(/\.ts$/, "")}`)) as Record<string, RouteHandler>;
    const dir = file.replace(/\/?route\.ts$/, "");
    const template = `/api/v1${dir ? `/${dir}` : ""}`;
    const paramNames = [...template.matchAll(/\[([^\]]+)\]/g)].map((m) => m[1]);
    for (const method of METHODS) {
      const handler = mod[method];
      if (handler?.spec) out.push({ template, method, spec: handler.spec, handler, paramNames });
    }
  }
  return out;
}

/** The template with each [name] replaced by its value. */
export function fillTemplate(template: string, values: Record<string, string>): string {
  return template.replace(/\[([^\]]+)\]/g, (_, name: string) => encodeURIComponent(values[name] ?? "1"));
}

export const isMutating = (route: ListedRoute) => route.method !== "GET";
