// The caution shown wherever the site hands out numbers that someone will fly with.
// Sources: University of Washington EH&S
// battery guidance for 4.20 V full and 3.0 V floor; BMFA for the off-load floor; landing voltage
// under load is common practice, no source).
export function SafetyNote() {
  return (
    <aside aria-labelledby="safety-title" className="overflow-hidden rounded-md border-3 border-caution-edge bg-caution">
      <div className="sb-hazard h-3" aria-hidden="true" />
      <div className="px-4 py-4 sm:px-5">
        <h2 id="safety-title" className="font-display text-heading uppercase">
          Before you trust a number
        </h2>
        <ul className="mt-3 list-disc space-y-2 pl-5">
          <li>
            <strong>LiPo limits.</strong> A standard pack is full at <span className="font-mono">4.20&nbsp;V</span> per cell; do not charge it higher, and do
            not discharge below <span className="font-mono">3.0&nbsp;V</span> per cell off load. Common practice is to land at about{" "}
            <span className="font-mono">3.3–3.5&nbsp;V</span> per cell under load.
          </li>
          <li>
            <strong>Measure first.</strong> Check the pack voltage with a multimeter and compare it with your OSD before you rely on any value from this page.
          </li>
          <li>
            <strong>The maker comes first.</strong> These are community values. Your board maker&rsquo;s instructions, your charger&rsquo;s manual and local
            rules take precedence.
          </li>
        </ul>
      </div>
    </aside>
  );
}
