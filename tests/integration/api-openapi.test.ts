import { describe, expect, it } from "vitest";
import { GET } from "@/app/api/v1/openapi.json/route";
import { CatalogueParamsSchema } from "@/lib/catalogue/search-params";
import { ValuesQuerySchema } from "@/lib/published/api-schemas";
import { submissionSchema } from "@/lib/submissions/schema";

// GET /api/v1/openapi.json. The structure checks follow the OpenAPI Specification 3.0.3
// (spec.openapis.org/oas/v3.0.3): required top-level fields openapi, info (title, version) and
// paths; each operation needs responses; path templates must have matching required path parameters;
// every $ref must resolve inside the document. (The library validator openapi-spec-validator was
// also run on the output by hand when this was written; it is not a dependency of the project.)

const get = (headers: Record<string, string> = {}) => GET(new Request("http://test.local/api/v1/openapi.json", { headers }), undefined);

type Json = Record<string, unknown>;

function refsIn(node: unknown, out: string[] = []): string[] {
  if (Array.isArray(node)) node.forEach((n) => refsIn(n, out));
  else if (node && typeof node === "object") {
    for (const [k, v] of Object.entries(node)) {
      if (k === "$ref" && typeof v === "string") out.push(v);
      else refsIn(v, out);
    }
  }
  return out;
}

function resolve(doc: Json, ref: string): unknown {
  expect(ref.startsWith("#/")).toBe(true);
  return ref
    .slice(2)
    .split("/")
    .reduce<unknown>((node, key) => (node && typeof node === "object" ? (node as Json)[key] : undefined), doc);
}

describe("GET /api/v1/openapi.json", () => {
  it("is an OpenAPI 3 document with the required top-level fields", async () => {
    const res = await get();
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^application\/json/);
    const doc = await res.json();
    expect(doc.openapi).toMatch(/^3\.\d+\.\d+$/);
    expect(typeof doc.info.title).toBe("string");
    expect(typeof doc.info.version).toBe("string");
    expect(doc.servers[0].url).toBe("/api/v1");
    expect(Object.keys(doc.paths).sort()).toEqual(["/boards", "/boards/{slug}", "/boards/{slug}/values", "/openapi.json", "/submissions", "/submissions/{id}"]);
  });

  it("every operation has responses, and every templated path declares its path parameter", async () => {
    const doc = await (await get()).json();
    for (const [path, item] of Object.entries<Json>(doc.paths)) {
      const op = item.get as Json;
      expect(op, path).toBeDefined();
      expect(Object.keys(op.responses as Json)).toContain("200");
      const names = [...path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]);
      const params = (op.parameters ?? []) as { name: string; in: string; required?: boolean }[];
      for (const name of names) expect(params.find((p) => p.in === "path" && p.name === name)?.required).toBe(true);
      for (const p of params) expect(["query", "header", "path", "cookie"]).toContain(p.in);
    }
  });

  it("every $ref resolves inside the document", async () => {
    const doc = await (await get()).json();
    const refs = refsIn(doc);
    expect(refs.length).toBeGreaterThan(5);
    for (const ref of refs) expect(resolve(doc, ref), ref).toBeDefined();
  });

  it("documents the parameters from the same zod schemas that parse them", async () => {
    const doc = await (await get()).json();
    const names = (path: string) => (doc.paths[path].get.parameters as { name: string; in: string }[]).filter((p) => p.in === "query").map((p) => p.name);
    expect(names("/boards")).toEqual(Object.keys(CatalogueParamsSchema.shape));
    expect(names("/boards/{slug}/values")).toEqual(Object.keys(ValuesQuerySchema.shape));
    const page = doc.paths["/boards"].get.parameters.find((p: { name: string }) => p.name === "page");
    expect(page.schema.pattern).toBe("^[0-9]+$");
    const kind = doc.paths["/boards"].get.parameters.find((p: { name: string }) => p.name === "kind");
    expect(kind.schema.enum).toContain("flight_controller");
  });

  it("describes the responses, including the values' statistics and the one error body", async () => {
    const doc = await (await get()).json();
    const values = doc.paths["/boards/{slug}/values"].get.responses;
    expect(Object.keys(values).sort()).toEqual(["200", "304", "400", "404", "500", "503"]);
    expect(values["200"].headers).toHaveProperty("ETag");
    expect(values["404"].content["application/json"].schema.$ref).toBe("#/components/schemas/Error");
    const q = doc.components.schemas.QuantityValues.properties;
    for (const field of ["n", "median", "q1", "q3", "mad", "ciLow", "ciHigh", "recommended", "confidence", "lastChangeAt", "points"])
      expect(q).toHaveProperty(field);
    expect(doc.components.schemas.ValuePoint.required.sort()).toEqual(["date", "method", "modifiedZ", "outlier", "value"]);
    expect(doc.components.schemas.Error.properties.error.required.sort()).toEqual(["code", "fieldErrors", "message", "status"]);
  });

  it("carries an ETag and answers 304 to it", async () => {
    const res = await get();
    const etag = res.headers.get("etag")!;
    expect(etag).toMatch(/^".+"$/);
    expect(res.headers.get("cache-control")).toMatch(/^public/);
    expect((await get({ "if-none-match": etag })).status).toBe(304);
  });

  it("documents the contribution endpoints: the body from the form's own schema, the key, the session", async () => {
    const doc = await (await get()).json();
    const create = doc.paths["/submissions"].post;
    expect(create.requestBody.content["application/json"].schema.$ref).toBe("#/components/schemas/SubmissionInput");
    // the same fields the form and the handler parse (lib/submissions/schema.ts); the schema's
    // cross-field refinement keeps .shape out of reach, so the keys are read from a parse of {}
    const fields = Object.keys(doc.components.schemas.SubmissionInput.properties).sort();
    const parsedKeys = new Set(
      submissionSchema()
        .safeParse({})
        .error!.issues.map((i) => String(i.path[0])),
    );
    for (const key of parsedKeys) expect(fields).toContain(key);
    expect(fields).toEqual(
      expect.arrayContaining([
        "boardRevisionId",
        "firmwareFamilyId",
        "method",
        "voltageScale",
        "currentScale",
        "currentOffset",
        "cycles",
        "bench",
        "voltageCheck",
        "photoIds",
      ]),
    );
    expect(create.parameters.find((p: { name: string }) => p.name === "Idempotency-Key")).toMatchObject({ in: "header", required: false });
    expect(Object.keys(create.responses).sort()).toEqual(["201", "400", "401", "413", "422", "500", "503"]);
    expect(create.security).toEqual([{ session: [] }]);
    expect(doc.components.securitySchemes.session).toMatchObject({ type: "apiKey", in: "cookie" });
    const edit = doc.paths["/submissions/{id}"].patch;
    expect(edit.requestBody.content["application/json"].schema.allOf[0].required).toEqual(["version"]);
    expect(Object.keys(edit.responses)).toContain("409");
    expect(doc.components.schemas.Submission.required).toEqual(expect.arrayContaining(["id", "status", "version", "evidence", "links"]));
  });
});
