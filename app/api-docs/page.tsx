import type { Metadata } from "next";
import Link from "next/link";
import { headers } from "next/headers";
import { SafetyNote } from "@/components/safety-note";
import { openApiDocument } from "@/lib/openapi/document";
import { componentNames, fieldRows, operations, type OperationView } from "@/lib/openapi/view";
import { listBoards } from "@/lib/catalogue/list-boards";
import { parseCatalogueParams } from "@/lib/catalogue/search-params";
import { ApiOperation } from "./api-operation";
import { SchemaTable } from "./schema-table";
import { TitledSection } from "@/components/titled-section";

export const dynamic = "force-dynamic";

export const metadata: Metadata = {
  title: "API",
  description: "Shuntbook's public JSON API: the board catalogue and the community's calibration values, with caching and one error shape.",
};

/** The address people reach this site at, for copy-and-paste examples. */
async function siteOrigin(): Promise<string> {
  const h = await headers();
  const host = h.get("x-forwarded-host") ?? h.get("host") ?? "localhost:3000";
  const proto = h.get("x-forwarded-proto") ?? (host.startsWith("localhost") || host.startsWith("127.") ? "http" : "https");
  return `${proto}://${host}`;
}

/** A board that exists, so the examples work when pasted; the docs still render without a database. */
async function exampleSlug(): Promise<string> {
  try {
    const parsed = parseCatalogueParams({ sort: "values", pageSize: "1" });
    if (!parsed.ok) return "example-f7";
    return (await listBoards(parsed.params)).rows[0]?.slug ?? "example-f7";
  } catch {
    return "example-f7";
  }
}

function exampleQuery(op: OperationView, slug: string): string {
  const path = op.path.replace("{slug}", slug).replace("{id}", "42");
  if (op.id === "listBoards") return `${path}?q=f7&kind=flight_controller&sort=values`;
  if (op.id === "getBoardValues") return `${path}?points=1`;
  return path;
}

/** A curl line that works when pasted (with the reader's own cookie and body file where needed). */
function exampleCurl(op: OperationView, base: string, slug: string): string {
  const url = `'${base}${exampleQuery(op, slug)}'`;
  const cookie = op.security.length ? " --cookie 'next-auth.session-token=…'" : "";
  if (op.method === "GET") return `curl -s${cookie} ${url}`;
  const key = op.id === "createSubmission" ? ' -H "Idempotency-Key: $(uuidgen)"' : "";
  return `curl -s -X ${op.method}${cookie} -H 'content-type: application/json'${key} --data @submission.json ${url}`;
}

export default async function ApiDocsPage() {
  const { document } = openApiDocument();
  const [origin, slug] = await Promise.all([siteOrigin(), exampleSlug()]);
  const base = `${origin}${document.servers?.[0]?.url ?? ""}`;
  const ops = operations(document);
  const schemas = componentNames(document);

  return (
    <div className="space-y-10">
      <header className="max-w-prose">
        <p className="font-display text-lg font-bold tracking-wider text-copper uppercase">For developers</p>
        <h1 className="font-display text-title uppercase">{document.info.title}</h1>
        <p className="mt-3 text-lead">{document.info.description}</p>
      </header>

      <div className="grid gap-8 lg:grid-cols-[1fr_22rem] lg:items-start">
        <TitledSection id="basics" title="The basics" className="space-y-4">
          <dl className="grid gap-px overflow-hidden rounded-md border-3 border-rule bg-rule sm:grid-cols-2">
            {[
              { term: "Base address", value: <code className="font-mono break-all">{base}</code> },
              { term: "Version", value: <span className="font-mono">v1 · {document.info.version}</span> },
              { term: "Sign-in", value: "None to read. Sending and editing contributions needs the site's session cookie." },
              {
                term: "Machine-readable",
                value: (
                  <a href="/api/v1/openapi.json" className="font-mono font-semibold">
                    openapi.json
                  </a>
                ),
              },
            ].map((f) => (
              <div key={f.term} className="bg-surface px-4 py-3">
                <dt className="font-display text-base font-semibold tracking-wide text-muted uppercase">{f.term}</dt>
                <dd className="mt-1">{f.value}</dd>
              </div>
            ))}
          </dl>
          <ul className="list-disc space-y-2 pl-5">
            <li>
              <strong>Settings, not volts.</strong> Every figure in a values response is a firmware setting, a whole number of the family&rsquo;s step. The
              response lists each family&rsquo;s units: value = setting × step.
            </li>
            <li>
              <strong>Caching.</strong> Every success carries an <code className="font-mono">ETag</code> and <code className="font-mono">Cache-Control</code>.
              Send the tag back in <code className="font-mono">If-None-Match</code> and you get <code className="font-mono">304</code> with no body while
              nothing has changed.
            </li>
            <li>
              <strong>Errors.</strong> Every 4xx and 5xx has the same body (see <a href="#schema-Error">Error</a>): <code className="font-mono">400</code> names
              each bad parameter in <code className="font-mono">fieldErrors</code>, <code className="font-mono">404</code> says which name matched nothing.
              Errors are never cached.
            </li>
          </ul>
          <nav aria-labelledby="endpoints-title">
            <h3 id="endpoints-title" className="font-display text-lg font-bold tracking-wide uppercase">
              Endpoints
            </h3>
            <ul className="mt-2 space-y-1">
              {ops.map((op) => (
                <li key={op.id}>
                  <a href={`#op-${op.id}`} className="font-mono">
                    {op.method} {op.path}
                  </a>{" "}
                  <span className="text-muted">— {op.summary}</span>
                </li>
              ))}
            </ul>
          </nav>
        </TitledSection>
        <div className="lg:sticky lg:top-4">
          <SafetyNote />
        </div>
      </div>

      {ops.map((op) => (
        <ApiOperation key={op.id} op={op} curl={exampleCurl(op, base, slug)} />
      ))}

      <TitledSection id="schemas" title="Fields" className="space-y-6">
        {schemas.map((name) => {
          const schema = document.components!.schemas![name];
          return (
            <SchemaTable
              key={name}
              name={name}
              description={"description" in schema ? schema.description : undefined}
              nullable={"nullable" in schema ? Boolean(schema.nullable) : false}
              rows={fieldRows(schema)}
            />
          );
        })}
      </TitledSection>

      <p>
        <Link href="/boards" className="font-semibold">
          Browse the boards on the site
        </Link>
      </p>
    </div>
  );
}
