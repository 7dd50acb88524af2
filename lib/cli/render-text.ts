/** The readable terminal report of the CLI. */
import type { Report } from "@/lib/engine";
import { unitLabel } from "@/lib/layout/units";
import { axisName, dir, num, vec } from "@/lib/analysis/format";
import { serviceSections } from "@/lib/report/service-sections";
import { CAUTION } from "@/lib/caution";

const mark = { error: "ERROR  ", warning: "WARNING", info: "INFO   " } as const;

/** Renders a report for a terminal (plain text, markdown bodies indented). */
export function renderText(r: Report): string {
  const u = unitLabel(r.units.length);
  const lines: string[] = [];
  const c = r.counts;
  lines.push(`${r.layout}`);
  lines.push(`${"=".repeat(Math.min(78, r.layout.length))}`);
  lines.push(`bodies ${c.bodies}   contacts ${c.contacts}   rank ${c.rank}`);
  lines.push(`freedoms ${c.freedoms}   redundancies ${c.redundancies}   Grübler–Kutzbach 6N − m = ${c.grubler}`);
  lines.push(`conditioning σ_r/σ_max ${num(r.conditioning)}   characteristic length ${num(r.scaling.length)} ${u}   centroid ${vec(r.scaling.centroid, u)}`);
  if (r.freeMotions.length) {
    lines.push("", "Free motions");
    r.freeMotions.forEach((m, i) => {
      for (const [b, s] of Object.entries(m.screws)) {
        if (s.kind === "still") continue;
        const d = s.direction!;
        const name = axisName(d) ?? dir(d);
        const text =
          s.kind === "translation"
            ? `translation along ${name}`
            : `${s.kind} about ${name} through ${vec(s.point!, u)}${s.kind === "screw" ? `, pitch ${num(s.pitch!)} ${u}/rad` : ""}`;
        lines.push(`  ${i + 1}. ${b}: ${text}`);
      }
    });
  }
  if (r.selfStressDimension) {
    lines.push("", `Over-constrained loops (self-stress states): ${r.selfStressDimension}`);
    r.selfStress.forEach((s, i) => {
      const parts = Object.entries(s.forces).map(([k, v]) => `${k} ${num(v, 3)}`);
      lines.push(`  ${i + 1}. pivot ${s.pivot}: ${parts.join(", ")}`);
    });
  }
  const solved = r.loadCases.filter((c) => c.seating);
  if (solved.length) {
    const fu = r.units.force;
    const ids = [...new Set(solved.flatMap((c) => Object.keys(c.seating!.forces ?? {})))];
    lines.push("", `Seat forces by load case (${fu}; stiffness: ${solved[0].seating!.stiffness}; < marks each seat's worst case)`);
    lines.push(`  ${"contact".padEnd(12)}${solved.map((c) => c.id.slice(0, 18).padStart(20)).join("")}`);
    for (const id of ids) {
      const cells = solved.map((c) =>
        c.seating!.forces === null ? "not held" : c.seating!.liftOff.includes(id) ? "lifts off" : num(c.seating!.forces[id] ?? 0),
      );
      const values = solved.map((c) => (c.seating!.forces === null || c.seating!.liftOff.includes(id) ? -Infinity : (c.seating!.forces[id] ?? 0)));
      const worst = solved.length > 1 ? values.indexOf(Math.min(...values)) : -1;
      lines.push(`  ${id.padEnd(12)}${cells.map((v, i) => (v + (i === worst ? " <" : "  ")).padStart(20)).join("")}`);
    }
    lines.push(`  ${"margin".padEnd(12)}${solved.map((c) => (c.seating!.margin === null ? "—" : num(c.seating!.margin)).padStart(18) + "  ").join("")}`);
  }
  if (r.foundation) lines.push("", `Foundation coupling: at most ${num(r.foundation.maxPerMicrometre)} ${r.units.force} per µm of support rise`);
  const service = serviceSections(r, "");
  if (service.length) lines.push("", ...service.map((l) => (l.startsWith(" ") ? l.trimStart() : l)));
  lines.push("", `Findings: ${r.findings.length}`);
  let caution = false;
  for (const f of r.findings) {
    lines.push("", `${mark[f.severity]} ${f.rule}: ${f.title}`);
    caution ||= f.body.includes(CAUTION);
    for (const l of f.body.replace(CAUTION, "").trimEnd().split("\n")) lines.push(`    ${l}`);
  }
  if (caution) lines.push("", CAUTION.replace(/^> /, ""));
  lines.push("");
  return lines.join("\n");
}
