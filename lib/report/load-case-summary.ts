/** One sentence for seating across every load case: the worst case first (not held, lift-off, smallest margin). */
import type { Report } from "@/lib/engine";

export interface LoadCaseSummary {
  cases: number;
  notHeld: string[];
  liftOff: { id: string; seats: string[] }[];
  worstMargin: { id: string; margin: number } | null;
  text: string;
}

/** Summarises seating over all load cases of a report (null when no case was solved). */
export function summariseLoadCases(r: Report): LoadCaseSummary | null {
  const solved = r.loadCases.filter((c) => c.seating);
  if (!solved.length) return null;
  const notHeld = solved.filter((c) => c.seating!.forces === null).map((c) => c.id);
  const liftOff = solved.filter((c) => c.seating!.forces !== null && c.seating!.liftOff.length).map((c) => ({ id: c.id, seats: c.seating!.liftOff }));
  let worstMargin: LoadCaseSummary["worstMargin"] = null;
  for (const c of solved) {
    const m = c.seating!.forces === null ? null : c.seating!.margin;
    if (m !== null && (worstMargin === null || m < worstMargin.margin)) worstMargin = { id: c.id, margin: m };
  }
  const parts: string[] = [];
  if (notHeld.length) parts.push(`not held in ${notHeld.length} of ${solved.length} (${notHeld.join(", ")})`);
  if (liftOff.length) parts.push(`seats lift off in ${liftOff.map((l) => `${l.id} (${l.seats.join(", ")})`).join("; ")}`);
  if (worstMargin) parts.push(`smallest seating margin ${worstMargin.margin.toPrecision(3)} in ${worstMargin.id}`);
  if (!notHeld.length && !liftOff.length) parts.unshift(`held in all ${solved.length}`);
  return {
    cases: solved.length,
    notHeld,
    liftOff,
    worstMargin,
    text: `Seating over ${solved.length} load case${solved.length === 1 ? "" : "s"}: ${parts.join("; ")}.`,
  };
}
