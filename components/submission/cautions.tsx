import type { ReactNode } from "react";

// The cautions beside each kind of measurement. The figures and advice come from:
// LiPo charging from the BMFA safety guidance and the University of
// Washington EH&S battery guidance; the bench rules from model-flying club safety rules; never
// shorting the probes and a DC-rated clamp meter are common practice, no source. Each box ends by
// deferring to the maker's instructions and local rules.

function Caution({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <aside aria-labelledby={id} className="overflow-hidden rounded-md border-3 border-caution-edge bg-caution">
      <div className="sb-hazard h-2" aria-hidden="true" />
      <div className="px-4 py-3">
        <h4 id={id} className="font-display text-lg font-bold tracking-wide uppercase">
          {title}
        </h4>
        <ul className="mt-2 list-disc space-y-1 pl-5 text-small">{children}</ul>
      </div>
    </aside>
  );
}

const MakerFirst = () => (
  <li>
    <strong>The maker comes first.</strong> Follow your board&rsquo;s, meter&rsquo;s and charger&rsquo;s instructions and your local rules where they say
    otherwise.
  </li>
);

export function ProbeCaution() {
  return (
    <Caution id="caution-probes" title="Measuring pack voltage">
      <li>
        <strong>Never short the probes.</strong> Do not let the two tips touch each other, or bridge two pins or pads: a LiPo can push hundreds of amps through
        a short and burn you or the board.
      </li>
      <li>Set the meter to DC volts before touching the pack, black probe on the negative first.</li>
      <li>
        Measure the whole pack: on the main lead, or on the two <em>outer</em> pins of the balance plug.
      </li>
      <MakerFirst />
    </Caution>
  );
}

export function BenchCaution() {
  return (
    <Caution id="caution-bench" title="Bench tests are dangerous with props on">
      <li>
        <strong>Props off</strong> for every bit of setup. Unplug the battery rather than trusting an arming switch.
      </li>
      <li>
        For a current test with props on: <strong>restrain the quad</strong> firmly, point it away from people, keep clear of the prop arc and{" "}
        <strong>wear eye protection</strong>.
      </li>
      <li>
        Use a clamp meter <strong>rated for DC</strong>: an AC-only clamp reads nothing useful on a battery lead. Close the jaw round one lead only.
      </li>
      <li>Fit an inline fuse (a &ldquo;smoke stopper&rdquo;) for the first power-up.</li>
      <MakerFirst />
    </Caution>
  );
}

export function ChargingCaution() {
  return (
    <Caution id="caution-charging" title="Charging LiPo packs">
      <li>
        <strong>Never leave a pack charging unattended.</strong>
      </li>
      <li>Charge on a non-flammable surface or in a fire-retardant bag.</li>
      <li>
        Charge at <strong>no more than 1C</strong> (1 × the pack&rsquo;s capacity in amps) unless its maker allows more, and not above{" "}
        <span className="font-mono">4.20&nbsp;V</span> a cell (<span className="font-mono">4.35&nbsp;V</span> for high-voltage packs).
      </li>
      <li>Stop using a swollen or damaged pack.</li>
      <MakerFirst />
    </Caution>
  );
}
