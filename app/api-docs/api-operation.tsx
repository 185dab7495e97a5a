import { ColumnHeads } from "@/components/column-heads";
import type { OperationView } from "@/lib/openapi/view";
import { SchemaRows } from "./schema-table";

// One endpoint of the API docs page: what it does, its parameters, its body, its responses, and a curl line.
export function ApiOperation({ op, curl }: { op: OperationView; curl: string }) {
  return (
    <section id={`op-${op.id}`} aria-labelledby={`op-${op.id}-title`} className="scroll-mt-4 space-y-4 rounded-md border-3 border-rule bg-surface p-4 sm:p-6">
      <h2 id={`op-${op.id}-title`} className="flex flex-wrap items-baseline gap-3">
        <span className="rounded-sm bg-ink px-2 py-0.5 font-mono text-base font-bold text-paper">{op.method}</span>
        <span className="font-mono text-lg font-bold break-all">{`/api/v1${op.path}`}</span>
      </h2>
      {op.summary && <p className="text-lead">{op.summary}</p>}
      {op.description && <p className="max-w-prose">{op.description}</p>}
      {op.security.length > 0 && (
        <p className="max-w-prose font-semibold">Signed in only: send the session cookie the site sets when you sign in. Anyone else gets 401.</p>
      )}

      {op.parameters.length > 0 && (
        <div>
          <h3 className="font-display text-lg font-bold tracking-wide uppercase">Parameters</h3>
          <div className="mt-2 overflow-x-auto">
            <table className="w-full border-collapse text-left text-small">
              <thead>
                <tr className="border-b-2 border-rule">
                  <ColumnHeads heads={["Name", "In", "Accepts", { label: "Meaning", className: "py-2" }]} className="py-2 pr-4" />
                </tr>
              </thead>
              <tbody>
                {op.parameters.map((p) => (
                  <tr key={`${p.in}-${p.name}`} className="border-b border-rule-soft align-top">
                    <th scope="row" className="py-2 pr-4 font-mono font-bold">
                      {p.name}
                      {p.required && <span className="ml-1 font-body font-normal text-muted">(required)</span>}
                    </th>
                    <td className="py-2 pr-4">{p.in}</td>
                    <td className="py-2 pr-4">
                      {p.values ? (
                        <span className="font-mono">{p.values.join(" | ")}</span>
                      ) : (
                        <>
                          <span className="font-mono">{p.type}</span>
                          {p.pattern && (
                            <span className="block text-muted">
                              pattern <code className="font-mono break-all">{p.pattern}</code>
                            </span>
                          )}
                          {p.limits && <span className="block text-muted">{p.limits}</span>}
                        </>
                      )}
                    </td>
                    <td className="py-2">{p.description}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </div>
      )}

      {op.body && (
        <div>
          <h3 className="font-display text-lg font-bold tracking-wide uppercase">Body (JSON)</h3>
          {op.body.rows.length > 0 && <SchemaRows rows={op.body.rows} />}
          {op.body.refs.map((ref) => (
            <p key={ref} className="mt-2">
              {op.body!.rows.length > 0 ? "And every field of " : "The fields of "}
              <a href={`#schema-${ref}`} className="font-mono">
                {ref}
              </a>
              .
            </p>
          ))}
        </div>
      )}

      <div>
        <h3 className="font-display text-lg font-bold tracking-wide uppercase">Responses</h3>
        <ul className="mt-2 space-y-1">
          {op.responses.map((r) => (
            <li key={r.status}>
              <span className="font-mono font-bold">{r.status}</span> {r.description}
              {r.ref && (
                <>
                  {" "}
                  Body:{" "}
                  <a href={`#schema-${r.ref}`} className="font-mono">
                    {r.ref}
                  </a>
                  .
                </>
              )}
              {r.headers.length > 0 && <span className="text-muted"> Headers: {r.headers.join(", ")}.</span>}
            </li>
          ))}
        </ul>
      </div>

      <div>
        <h3 className="font-display text-lg font-bold tracking-wide uppercase">Try it</h3>
        <pre className="mt-2 overflow-x-auto rounded-md bg-sunken p-3 font-mono text-small">
          <code>{curl}</code>
        </pre>
      </div>
    </section>
  );
}
