import { ColumnHeads } from "@/components/column-heads";
import type { FieldRow } from "@/lib/openapi/view";

/** A table of fields, nested fields indented: for a component schema or a request body. */
export function SchemaRows({ rows }: { rows: FieldRow[] }) {
  return (
    <div className="mt-2 overflow-x-auto">
      <table className="w-full border-collapse text-left text-small">
        <thead>
          <tr className="border-b-2 border-rule">
            <ColumnHeads heads={["Field", "Type", { label: "Meaning", className: "py-2" }]} className="py-2 pr-4" />
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.path} className="border-b border-rule-soft align-top">
              <th scope="row" className="py-2 pr-4 font-mono font-semibold" style={{ paddingLeft: `${row.depth * 1.25}rem` }}>
                {row.path.split(".").pop()}
                {!row.required && <span className="ml-1 font-body font-normal text-muted">(optional)</span>}
              </th>
              <td className="py-2 pr-4 font-mono">
                {row.ref ? <a href={`#schema-${row.ref}`}>{row.type}</a> : row.type}
                {row.nullable && <span className="text-muted"> or null</span>}
                {row.values && <span className="block text-muted">{row.values.join(" | ")}</span>}
              </td>
              <td className="py-2">{row.description}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

// One component schema of the API docs page as a table of its fields.
export function SchemaTable({ name, description, nullable, rows }: { name: string; description?: string; nullable: boolean; rows: FieldRow[] }) {
  return (
    <section id={`schema-${name}`} aria-labelledby={`schema-${name}-title`} className="scroll-mt-4">
      <h3 id={`schema-${name}-title`} className="font-mono text-lg font-bold">
        {name}
      </h3>
      {description && <p className="mt-1 max-w-prose">{description}</p>}
      {nullable && <p className="mt-1 text-muted">May be null where it is used.</p>}
      <SchemaRows rows={rows} />
    </section>
  );
}
