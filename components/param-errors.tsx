import Link from "next/link";

/**
 * Shown instead of results when the address bar holds parameters a list cannot use (the board
 * catalogue, "My submissions"): says which parameter is wrong and why, and offers a link without it.
 */
export function ParamErrors({
  fieldErrors,
  withoutField,
  list = "board list",
  showWhat = "boards",
  startOver = { href: "/boards", label: "Start again with all boards" },
}: {
  fieldErrors: Record<string, string[]>;
  /** The list's URL with this one parameter removed (and the others kept). */
  withoutField: (field: string) => string;
  /** "The ___ was not loaded." */
  list?: string;
  /** "Remove <field> and show ___". */
  showWhat?: string;
  startOver?: { href: string; label: string };
}) {
  const fields = Object.keys(fieldErrors);
  return (
    <section aria-labelledby="param-errors-title" className="rounded-md border-3 border-fault bg-fault-wash p-4 sm:p-6" role="alert">
      <h2 id="param-errors-title" className="font-display text-heading text-fault uppercase">
        This address has {fields.length === 1 ? "a setting" : "settings"} we can&rsquo;t use
      </h2>
      <p className="mt-2">The {list} was not loaded. Fix or remove the part below and try again.</p>
      <dl className="mt-4 space-y-3">
        {fields.map((field) => (
          <div key={field} className="rounded-md border-2 border-rule bg-surface p-3">
            <dt className="font-mono font-bold">{field}</dt>
            <dd className="mt-1">
              <ul className="space-y-1">
                {fieldErrors[field].map((message) => (
                  <li key={message}>{message}</li>
                ))}
              </ul>
              <Link href={withoutField(field)} className="mt-2 inline-block font-semibold">
                Remove <span className="font-mono">{field}</span> and show {showWhat}
              </Link>
            </dd>
          </div>
        ))}
      </dl>
      <p className="mt-4">
        <Link href={startOver.href} className="font-semibold">
          {startOver.label}
        </Link>
      </p>
    </section>
  );
}
