import type { SubmissionView } from "@/lib/submissions";

// A submission's evidence as the contributor entered it: voltage readings, fly-and-recharge
// cycles and bench points, each as a small table a moderator can read on a phone.

function Table({ caption, head, rows }: { caption: string; head: string[]; rows: (string | number)[][] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left text-small">
        <caption className="text-left font-semibold">{caption}</caption>
        <thead>
          <tr>
            {head.map((h) => (
              <th key={h} scope="col" className="border-b-2 border-rule px-2 py-1">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r, i) => (
            <tr key={i}>
              {r.map((c, j) => (
                <td key={j} className="border-b border-rule-soft px-2 py-1 font-mono">
                  {c}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function EvidenceTables({ s }: { s: Pick<SubmissionView, "voltageCheck" | "cycles" | "bench"> }) {
  return (
    <>
      {s.voltageCheck && (
        <Table
          caption={`Voltage readings at voltage scale ${s.voltageCheck.scaleUsed}`}
          head={["Cells", "OSD volts", "Multimeter volts"]}
          rows={s.voltageCheck.readings.map((r) => [r.cells ?? "—", r.reportedVolts, r.measuredVolts])}
        />
      )}
      {s.cycles && s.cycles.length > 0 && (
        <Table
          caption="Fly-and-recharge cycles"
          head={["Current scale", "OSD mAh", "Charged mAh", "Pack mAh", "Cells"]}
          rows={s.cycles.map((c) => [c.scaleUsed, c.reportedMah, c.chargedMah, c.ratedMah, c.cells])}
        />
      )}
      {s.bench && (
        <Table
          caption={`Bench points at current scale ${s.bench.scaleUsed}, offset ${s.bench.offsetUsed}`}
          head={["OSD amps", "Clamp-meter amps"]}
          rows={s.bench.points.map((p) => [p.reportedAmps, p.measuredAmps])}
        />
      )}
    </>
  );
}
