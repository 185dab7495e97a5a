import type { ReactNode } from "react";

// The shared frame of the account pages: a kicker, a title, a short lead, then the forms in
// cards that stack on a phone and sit side by side from a tablet up.

export function AccountPage({ kicker, title, lead, children }: { kicker: string; title: string; lead?: ReactNode; children: ReactNode }) {
  return (
    <div className="space-y-8 pb-12">
      <header className="max-w-prose">
        <p className="font-display text-lg font-bold tracking-wider uppercase">{kicker}</p>
        <h1 className="font-display text-title uppercase">{title}</h1>
        {lead && <p className="mt-3 text-lead">{lead}</p>}
      </header>
      {children}
    </div>
  );
}

export function Card({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="rounded-md border-3 border-rule bg-surface p-4 sm:p-6">
      <h2 id={id} className="mb-4 font-display text-heading uppercase">
        {title}
      </h2>
      {children}
    </section>
  );
}
