/**
 * Report sections for the service analyses (analysis.md §9–§11) in markdown: flexures with their rows,
 * temperature (thermal centres, drift, thermal forces) and the repeatability budget. Pure: used by the
 * release report (markdown and PDF) and the command-line text.
 */
import type { Report } from "@/lib/engine";
import { num, vec } from "@/lib/analysis/format";
import { unitLabel } from "@/lib/layout/units";

const mag = (v: number[]) => Math.hypot(...v);

/** The markdown lines of the flexure, temperature and repeatability sections (empty when none apply). */
export function serviceSections(r: Report, heading = "##"): string[] {
  const u = unitLabel(r.units.length);
  const fu = unitLabel(r.units.force);
  const lines: string[] = [];
  if (r.flexures.length) {
    lines.push(`${heading} Flexures (${r.flexures.length})`, "", "| flexure | kind | rows |", "|---|---|---|");
    for (const f of r.flexures) lines.push(`| ${f.id} | ${f.kind} | ${f.rows.join(", ")} |`);
    lines.push("");
  }
  const t = r.thermal;
  if (t) {
    const swing = t.swingK ?? 1;
    lines.push(
      `${heading} Temperature`,
      "",
      `Per kelvin and over ${t.swingK === null ? "1 K (no swing given)" : `a swing of ${num(swing)} K`}.${t.undetermined ? " A free motion remains: drift along it is not determined (smallest motion shown)." : ""}`,
      "",
    );
    lines.push(`| body | thermal centre (${u}) |`, "|---|---|");
    for (const [id, b] of Object.entries(t.bodies)) lines.push(`| ${id} | ${b.centre ? vec(b.centre) : "none (same expansion as the base)"} |`);
    const pts = Object.entries(t.points);
    if (pts.length) {
      lines.push("", `| point | drift per K (µm) | magnitude (µm/K) | over ${num(swing)} K (µm) |`, "|---|---|---|---|");
      for (const [id, p] of pts) lines.push(`| ${id} | ${vec(p.driftUmPerK)} | ${num(mag(p.driftUmPerK))} | ${num(mag(p.driftUmPerK) * swing)} |`);
    }
    if (t.forcesPerK === null) lines.push("", "Thermal forces: not computed (over-constrained in service, equal stiffness assumed).");
    else {
      const changed = Object.entries(t.forcesPerK).filter(([, v]) => v !== 0);
      if (!changed.length) lines.push("", "Thermal forces: none (the mount follows the mismatch as a rigid body).");
      else {
        lines.push("", `| row | force change per K (${fu}) | over ${num(swing)} K (${fu}) |`, "|---|---|---|");
        for (const [id, v] of changed) lines.push(`| ${id} | ${num(v)} | ${num(v * swing)} |`);
      }
    }
    lines.push("");
  }
  const rep = r.repeatability;
  if (rep) {
    lines.push(
      `${heading} Repeatability`,
      "",
      `Scatter of each functional point from seat scatter (1σ along each normal).${rep.undetermined ? " A free motion remains: scatter along it is not determined." : ""}`,
      "",
    );
    lines.push("| point | 1σ x, y, z (µm) | 3σ largest semi-axis (µm) | largest contributors |", "|---|---|---|---|");
    for (const [id, p] of Object.entries(rep.points)) {
      const top = Object.entries(p.contributions)
        .sort((a, b) => b[1] - a[1])
        .slice(0, 3)
        .map(([c, s]) => `${c} ${num(s * 100, 3)} %`)
        .join(", ");
      lines.push(`| ${id} | ${vec(p.sigmaUm)} | ${num(3 * p.semiAxesUm[0])} | ${top || "—"} |`);
    }
    lines.push("");
  }
  return lines;
}
