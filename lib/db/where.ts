/**
 * The WHERE of a raw query from optional filters: each `[condition, name, value]` whose value is set
 * (truthy) joins the conditions with AND and puts its value in `params` under `name`, the name its
 * condition uses ($name for bind, :name for replacements). No filter set: no WHERE at all.
 */
export function whereOf(filters: ReadonlyArray<readonly [condition: string, name: string, value: unknown]>, params: Record<string, unknown>): string {
  const conditions: string[] = [];
  for (const [condition, name, value] of filters) {
    if (!value) continue;
    conditions.push(condition);
    params[name] = value;
  }
  return conditions.length ? `WHERE ${conditions.join(" AND ")}` : "";
}
