/** Seat forces in every load case side by side, with each seat's worst case marked (least force or lift-off). */
import type { Report } from "@/lib/engine";

export function LoadCaseTable({ report }: { report: Report }) {
  const cases = report.loadCases.filter((c) => c.seating);
  if (!cases.length) return null;
  const ids = Object.keys(report.seating?.forces ?? cases.find((c) => c.seating?.forces)?.seating?.forces ?? {});
  if (!ids.length && cases.every((c) => !c.seating?.forces)) {
    return <p className="mt-3 text-xs text-severity-error">In every load case the load drives a free motion: no seating forces.</p>;
  }
  const all = report.loadCases.flatMap((c) => (c.seating?.forces ? Object.keys(c.seating.forces) : []));
  const contacts = [...new Set(all)];
  const worst = (id: string): string | null => {
    let best: { id: string; v: number } | null = null;
    for (const c of cases) {
      const lifted = c.seating!.liftOff.includes(id) || !c.seating!.forces;
      const v = lifted ? -Infinity : c.seating!.forces![id];
      if (!best || v < best.v) best = { id: c.id, v };
    }
    return best?.id ?? null;
  };
  const f = report.units.force;
  return (
    <div className="mt-4 overflow-x-auto">
      <h3 className="mb-1 text-sm font-semibold">Seat forces by load case ({f}; ◀ marks each seat’s worst case)</h3>
      <table className="tbl text-xs" data-testid="load-case-table">
        <thead>
          <tr>
            <th>contact</th>
            {cases.map((c) => (
              <th key={c.id} className="text-right">
                {c.id}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {contacts.map((id) => {
            const w = cases.length > 1 ? worst(id) : null;
            return (
              <tr key={id}>
                <td>{id}</td>
                {cases.map((c) => {
                  const lifted = c.seating!.liftOff.includes(id);
                  const v = c.seating!.forces?.[id];
                  return (
                    <td key={c.id} className={`num text-right ${w === c.id ? "font-semibold" : ""}`}>
                      {c.seating!.forces === null ? "not held" : lifted ? "× lifts off" : v === undefined ? "—" : Number(v.toPrecision(4))}
                      {w === c.id ? " ◀" : ""}
                    </td>
                  );
                })}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
