import Link from "next/link";

export function SiteFooter() {
  return (
    <footer className="mt-16 bg-paper">
      <div className="sb-scale rotate-180" aria-hidden="true" />
      <div className="mx-auto max-w-page px-4 py-6 text-small text-muted sm:px-6">
        <p className="max-w-prose">
          <strong className="text-ink">Community values, not maker specifications.</strong> Check pack voltage with a multimeter before trusting any reading,
          and follow your board maker&rsquo;s instructions and local flying rules.
        </p>
        <p className="mt-2">
          <Link href="/how-the-numbers-are-made">How the numbers are made</Link>
        </p>
        <p className="mt-2 font-display text-base font-semibold tracking-wide uppercase">Shuntbook</p>
      </div>
    </footer>
  );
}
