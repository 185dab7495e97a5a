import type { OpenAPIObject, OperationObject, ParameterObject, ReferenceObject, ResponseObject, SchemaObject } from "openapi3-ts/oas30";

// Flattens the OpenAPI document into plain rows for the /api-docs page: endpoints, parameters,
// responses and field tables. Only what our own generator emits is handled (objects, arrays,
// records, enums, $ref); it is a reader for this document, not a general OpenAPI renderer.

export type FieldRow = {
  /** Dotted path, "[]" for array items, "{key}" for record values: "revisions[].families[]". */
  path: string;
  depth: number;
  type: string;
  required: boolean;
  nullable: boolean;
  description?: string;
  /** Name of the component this field's type is, for a link. */
  ref?: string;
  values?: string[];
};

type ParameterRow = {
  name: string;
  in: string;
  required: boolean;
  type: string;
  values?: string[];
  pattern?: string;
  limits?: string;
  description?: string;
};

type ResponseRow = { status: string; description: string; ref?: string; headers: string[] };

/** A JSON request body: its own fields (inline parts) and the components it takes whole. */
type RequestBodyView = { rows: FieldRow[]; refs: string[] };

export type OperationView = {
  id: string;
  method: string;
  path: string;
  summary?: string;
  description?: string;
  /** Names of the security schemes that apply (for us: the session cookie). */
  security: string[];
  parameters: ParameterRow[];
  body?: RequestBodyView;
  responses: ResponseRow[];
};

const isRef = (s: unknown): s is ReferenceObject => typeof s === "object" && s !== null && "$ref" in s;
const refName = (ref: string) => ref.replace("#/components/schemas/", "");

function typeOf(schema: SchemaObject | ReferenceObject): { type: string; ref?: string } {
  if (isRef(schema)) return { type: refName(schema.$ref), ref: refName(schema.$ref) };
  if (schema.type === "array" && schema.items) {
    const inner = typeOf(schema.items);
    return { type: `${inner.type}[]`, ref: inner.ref };
  }
  if (schema.type === "object" && schema.additionalProperties && typeof schema.additionalProperties === "object") {
    const inner = typeOf(schema.additionalProperties);
    return { type: `map of ${inner.type}`, ref: inner.ref };
  }
  if (schema.allOf?.length === 1) return typeOf(schema.allOf[0]);
  const base = schema.type ?? "any";
  return { type: schema.format ? `${base} (${schema.format})` : String(base) };
}

/** Rows for every field of an object schema, nested objects indented below their parent. */
export function fieldRows(schema: SchemaObject | ReferenceObject, prefix = "", depth = 0): FieldRow[] {
  if (isRef(schema)) return [];
  const rows: FieldRow[] = [];
  const required = new Set(schema.required ?? []);
  for (const [name, raw] of Object.entries(schema.properties ?? {})) {
    const path = prefix ? `${prefix}.${name}` : name;
    const { type, ref } = typeOf(raw);
    const prop = isRef(raw) ? undefined : raw;
    rows.push({
      path,
      depth,
      type,
      ref,
      required: required.has(name),
      nullable: Boolean(prop?.nullable),
      description: prop?.description,
      values: prop?.enum?.map(String),
    });
    rows.push(...nestedRows(raw, path, depth + 1));
  }
  return rows;
}

function nestedRows(schema: SchemaObject | ReferenceObject, path: string, depth: number): FieldRow[] {
  if (isRef(schema)) return []; // a component: linked, described in its own table
  if (schema.type === "array" && schema.items) return nestedRows(schema.items, `${path}[]`, depth);
  if (schema.type === "object" && schema.properties) return fieldRows(schema, path, depth);
  if (schema.type === "object" && schema.additionalProperties && typeof schema.additionalProperties === "object") {
    return nestedRows(schema.additionalProperties, `${path}{key}`, depth);
  }
  return [];
}

function parameterRow(p: ParameterObject): ParameterRow {
  const schema = (p.schema && !isRef(p.schema) ? p.schema : {}) as SchemaObject;
  const limits = [
    schema.minLength !== undefined ? `at least ${schema.minLength} characters` : null,
    schema.maxLength !== undefined ? `at most ${schema.maxLength} characters` : null,
  ].filter(Boolean);
  return {
    name: p.name,
    in: p.in,
    required: Boolean(p.required),
    type: typeOf(schema).type,
    values: schema.enum?.map(String),
    pattern: schema.pattern,
    limits: limits.length ? limits.join(", ") : undefined,
    description: p.description ?? schema.description,
  };
}

function responseRow(status: string, r: ResponseObject | ReferenceObject): ResponseRow {
  if (isRef(r)) return { status, description: refName(r.$ref), headers: [] };
  const schema = r.content?.["application/json"]?.schema;
  return {
    status,
    description: r.description,
    ref: schema && isRef(schema) ? refName(schema.$ref) : undefined,
    headers: Object.keys(r.headers ?? {}),
  };
}

function requestBodyView(op: OperationObject): RequestBodyView | undefined {
  const body = op.requestBody;
  if (!body || isRef(body)) return undefined;
  const schema = body.content?.["application/json"]?.schema;
  if (!schema) return undefined;
  // an edit is allOf [its own fields, the component]: rows for the first, a link to the second
  const parts = !isRef(schema) && schema.allOf ? schema.allOf : [schema];
  return {
    rows: parts.flatMap((part) => fieldRows(part)),
    refs: parts.filter(isRef).map((part) => refName(part.$ref)),
  };
}

export function operations(doc: OpenAPIObject): OperationView[] {
  const out: OperationView[] = [];
  for (const [path, item] of Object.entries(doc.paths ?? {})) {
    for (const method of ["get", "post", "put", "patch", "delete"] as const) {
      const op = item[method] as OperationObject | undefined;
      if (!op) continue;
      out.push({
        id: op.operationId ?? `${method}-${path}`,
        method: method.toUpperCase(),
        path,
        summary: op.summary,
        description: op.description,
        security: (op.security ?? []).flatMap((requirement) => Object.keys(requirement)),
        parameters: (op.parameters ?? []).filter((p): p is ParameterObject => !isRef(p)).map(parameterRow),
        body: requestBodyView(op),
        responses: Object.entries(op.responses ?? {}).map(([status, r]) => responseRow(status, r as ResponseObject)),
      });
    }
  }
  return out;
}

/** Component schemas in the order they are first reached from the endpoints, then any others. */
export function componentNames(doc: OpenAPIObject): string[] {
  const all = Object.keys(doc.components?.schemas ?? {});
  const seen: string[] = [];
  const visit = (name: string) => {
    if (seen.includes(name) || !all.includes(name)) return;
    seen.push(name);
    for (const row of fieldRows(doc.components!.schemas![name])) if (row.ref) visit(row.ref);
  };
  for (const op of operations(doc)) {
    for (const ref of op.body?.refs ?? []) visit(ref);
    for (const r of op.responses) if (r.ref) visit(r.ref);
  }
  return [...seen, ...all.filter((n) => !seen.includes(n))];
}
