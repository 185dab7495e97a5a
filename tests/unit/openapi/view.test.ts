import { describe, expect, it } from "vitest";
import { openApiDocument } from "@/lib/openapi/document";
import { componentNames, fieldRows, operations } from "@/lib/openapi/view";

// The docs page's reading of the generated document.
describe("openapi-view", () => {
  const { document } = openApiDocument();

  it("lists each endpoint with its parameters and responses", () => {
    const ops = operations(document);
    expect(ops.map((o) => `${o.method} ${o.path}`)).toEqual([
      "GET /boards",
      "GET /boards/{slug}",
      "GET /boards/{slug}/values",
      "GET /submissions",
      "POST /submissions",
      "GET /submissions/{id}",
      "PATCH /submissions/{id}",
      "GET /openapi.json",
    ]);
    const values = ops.find((o) => o.id === "getBoardValues")!;
    expect(values.parameters.map((p) => p.name)).toEqual(["slug", "revision", "family", "points", "If-None-Match"]);
    expect(values.parameters.find((p) => p.name === "points")!.values).toEqual(["0", "1", "true", "false"]);
    expect(values.responses.find((r) => r.status === "200")!.ref).toBe("BoardValues");
  });

  it("reads request bodies and who may call", () => {
    const ops = operations(document);
    const create = ops.find((o) => o.id === "createSubmission")!;
    expect(create.body).toEqual({ rows: [], refs: ["SubmissionInput"] });
    expect(create.security).toEqual(["session"]);
    const edit = ops.find((o) => o.id === "editOwnSubmission")!;
    expect(edit.body!.rows.map((r) => r.path)).toEqual(["version"]);
    expect(edit.body!.refs).toEqual(["SubmissionInput"]);
    expect(ops.find((o) => o.id === "getBoard")!.security).toEqual([]);
    // the body's component is listed among the schemas the page describes
    expect(componentNames(document)).toContain("SubmissionInput");
  });

  it("flattens nested fields with paths and links components by name", () => {
    const rows = fieldRows(document.components!.schemas!.BoardValues);
    expect(rows.map((r) => r.path)).toContain("revisions[].families");
    expect(rows.find((r) => r.path === "revisions[].families")!.ref).toBe("GroupValues");
    expect(rows.find((r) => r.path === "lastChangeAt")!.nullable).toBe(true);
  });

  it("orders components as the endpoints reach them and misses none", () => {
    const names = componentNames(document);
    expect(names[0]).toBe("BoardList");
    expect([...names].sort()).toEqual(Object.keys(document.components!.schemas!).sort());
  });
});
