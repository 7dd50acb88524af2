"use client";
/**
 * Layout-page panels for the service questions (analysis.md §9–§11): the flexures with their derived
 * stiffness, the temperature panel (thermal centres, drift, thermal forces) and the repeatability
 * error budget (σ per axis, 3σ, contributions by contact as a bar chart and a sortable table).
 */
import { useState } from "react";
import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { Report } from "@/lib/engine";
import type { Layout } from "@/lib/layout/model";
import { expandFlexures, flexureLength } from "@/lib/layout/flexures";
import { metresPer } from "@/lib/layout/units";
import { num, vec } from "@/lib/analysis/format";
import { SortableTable, type Column } from "@/components/ui/sortable-table";
import { FilteredNote, type BodyScope } from "./body-filter";

/** A µm value compared with the point's allowance: marked "over" when it exceeds it. */
function againstAllowance<R extends { exceeds: boolean }>(key: string, label: string, value: (r: R) => number): Column<R> {
  return {
    key,
    label,
    numeric: true,
    sort: value,
    render: (r) => (
      <span className={r.exceeds ? "font-semibold text-severity-warning" : undefined}>
        {num(value(r))}
        {r.exceeds ? " over" : ""}
      </span>
    ),
  };
}

/** The point's allowance, shown in µm whatever the file's length unit. */
function allowanceColumn<R extends { allowance?: number }>(toUm: number): Column<R> {
  return {
    key: "allow",
    label: "allowance (µm)",
    numeric: true,
    sort: (r) => r.allowance ?? Infinity,
    render: (r) => (r.allowance === undefined ? "—" : num(r.allowance * toUm)),
  };
}

const lengthLabel = (layout: Layout) => (layout.units.length === "um" ? "µm" : layout.units.length);
const mag = (v: number[]) => Math.hypot(...v);

/** Each flexure element with its dimensions and the stiffness of its rows. */
export function FlexurePanel({ layout, scope }: { layout: Layout; scope: BodyScope }) {
  const all = layout.flexures ?? [];
  if (!all.length) return null;
  const flexures = all.filter((f) => scope.flexure(f.id));
  const L = lengthLabel(layout);
  const F = layout.units.force;
  const rows = expandFlexures(layout).contacts.filter((c) => c.flexure);
  return (
    <section className="sheet overflow-x-auto p-4" aria-labelledby="flexures-heading" data-testid="flexure-panel">
      <h2 id="flexures-heading" className="mb-2 text-base">
        Flexures ({all.length})
      </h2>
      <FilteredNote scope={scope} shown={flexures.length} total={all.length} what="flexures" />
      <SortableTable
        rows={flexures}
        rowKey={(f) => f.id}
        columns={[
          { key: "id", label: "flexure", sort: (f) => f.id, render: (f) => f.id },
          { key: "kind", label: "kind", sort: (f) => f.kind, render: (f) => f.kind },
          { key: "on", label: "body on", sort: (f) => `${f.body} ${f.on}`, render: (f) => `${f.body} on ${f.on}` },
          { key: "len", label: `length (${L})`, numeric: true, sort: (f) => flexureLength(f), render: (f) => num(flexureLength(f)) },
          {
            key: "section",
            label: `section (${L})`,
            sort: (f) => (f.kind === "wire" ? (f.diameter ?? 0) : f.width),
            render: (f) =>
              f.kind === "wire"
                ? f.diameter !== undefined
                  ? `⌀ ${num(f.diameter)}`
                  : "—"
                : `${num(f.width)} × ${f.thickness !== undefined ? num(f.thickness) : "—"}`,
          },
          { key: "material", label: "material", sort: (f) => f.material ?? "", render: (f) => f.material ?? "—" },
          {
            key: "k",
            label: `row stiffness (${F}/${L})`,
            sort: (f) => rows.find((r) => r.flexure === f.id)?.stiffness ?? -1,
            render: (f) => {
              const mine = rows.filter((r) => r.flexure === f.id);
              if (mine.some((r) => r.stiffness === undefined)) return "— (needs material modulus and section)";
              return mine
                .map((r) => `${r.id === f.id ? "axial" : r.id.endsWith(".s") ? "in plane" : `axial ${r.id.slice(-1)}`} ${num(r.stiffness!)}`)
                .join(" · ");
            },
          },
        ]}
      />
      <p className="mt-2 text-xs text-graphite-soft">
        Wire k = EA/ℓ; blade axial rows E·w·t/(2ℓ) each, in-plane row E·t·w³/ℓ³ (Euler–Bernoulli, good for w ≪ ℓ; a wide, short blade is softer in its plane
        through shear).
      </p>
    </section>
  );
}

/** Thermal centres, drift per kelvin and over the swing, and thermal forces where they have a magnitude. */
export function ThermalPanel({ layout, report, scope }: { layout: Layout; report: Report; scope: BodyScope }) {
  const t = report.thermal;
  if (!t) return null;
  const L = lengthLabel(layout);
  const F = layout.units.force;
  const swing = t.swingK ?? 1;
  const toUm = metresPer(layout.units.length) * 1e6;
  const allDrifts = Object.entries(t.points);
  const drifts = allDrifts
    .filter(([id]) => scope.point(id))
    .map(([id, p]) => {
      const allowance = layout.points.find((x) => x.id === id)?.allowance;
      return {
        id,
        d: p.driftUmPerK,
        perK: mag(p.driftUmPerK),
        over: mag(p.driftUmPerK) * swing,
        allowance,
        exceeds: allowance !== undefined && mag(p.driftUmPerK) * swing > allowance * toUm,
      };
    });
  const allForces = t.forcesPerK ? Object.entries(t.forcesPerK).filter(([, v]) => v !== 0) : [];
  const forces = allForces.filter(([id]) => scope.contact(id)).map(([id, v]) => ({ id, v }));
  const bodies = Object.entries(t.bodies).filter(([id]) => scope.bodyRow(id));
  return (
    <section className="sheet space-y-3 overflow-x-auto p-4" aria-labelledby="thermal-heading" data-testid="thermal-panel">
      <h2 id="thermal-heading" className="text-base">
        Temperature
      </h2>
      <p className="text-xs text-graphite-soft">
        Uniform change of temperature, every body and the base growing about the centroid of the contacts; results per kelvin and over{" "}
        {t.swingK === null ? "1 K (no swing given)" : `the swing of ${num(swing)} K`}.
        {t.undetermined ? " The kept seats leave a free motion: drift along it is not determined (smallest motion shown)." : ""}
      </p>
      <table className="tbl text-xs">
        <thead>
          <tr>
            <th>body</th>
            <th>thermal centre ({L})</th>
          </tr>
        </thead>
        <tbody>
          {bodies.map(([id, b]) => (
            <tr key={id}>
              <td>{id}</td>
              <td className="num">{b.centre ? vec(b.centre) : "none — same expansion as the base"}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {allDrifts.length > 0 && <FilteredNote scope={scope} shown={drifts.length} total={allDrifts.length} what="functional points" />}
      {drifts.length > 0 && (
        <SortableTable
          testId="thermal-drift-table"
          rows={drifts}
          rowKey={(r) => r.id}
          columns={[
            { key: "id", label: "point", sort: (r) => r.id, render: (r) => r.id },
            { key: "d", label: "drift per K (µm)", sort: (r) => r.perK, render: (r) => vec(r.d as [number, number, number]) },
            { key: "perK", label: "magnitude (µm/K)", numeric: true, sort: (r) => r.perK, render: (r) => num(r.perK) },
            againstAllowance<(typeof drifts)[number]>("over", `over ${num(swing)} K (µm)`, (r) => r.over),
            allowanceColumn(toUm),
          ]}
        />
      )}
      {t.forcesPerK === null ? (
        <p className="text-xs">
          The support is over-constrained in service, but no stiffness magnitude is known (equal stiffness assumed): thermal forces are not computed.
        </p>
      ) : allForces.length ? (
        <>
          <FilteredNote scope={scope} shown={forces.length} total={allForces.length} what="rows with a thermal force" />
          <SortableTable
            testId="thermal-force-table"
            rows={forces}
            rowKey={(r) => r.id}
            initial={{ key: "abs", desc: true }}
            columns={[
              { key: "id", label: "row", sort: (r) => r.id, render: (r) => r.id },
              { key: "abs", label: `force change per K (${F})`, numeric: true, sort: (r) => Math.abs(r.v), render: (r) => num(r.v) },
              { key: "swing", label: `over ${num(swing)} K (${F})`, numeric: true, sort: (r) => Math.abs(r.v), render: (r) => num(r.v * swing) },
            ]}
          />
        </>
      ) : (
        <p className="text-xs">No contact force changes with temperature: the mount follows the mismatch as a rigid body.</p>
      )}
    </section>
  );
}

/** The error budget: per point σ per axis and 3σ, and each contact's share of the variance. */
export function RepeatabilityPanel({ layout, report, scope }: { layout: Layout; report: Report; scope: BodyScope }) {
  const rep = report.repeatability;
  const allIds = Object.keys(rep?.points ?? {});
  const scoped = allIds.filter(scope.point);
  // a body without functional points keeps the whole budget rather than an empty panel
  const ids = scoped.length ? scoped : allIds;
  const [chosen, setPointId] = useState(ids[0] ?? "");
  if (!rep || !ids.length) return null;
  const toUm = metresPer(layout.units.length) * 1e6;
  const pointId = ids.includes(chosen) ? chosen : ids[0];
  const p = rep.points[pointId];
  const shares = Object.entries(p.contributions)
    .map(([id, share]) => ({ id, pct: share * 100 }))
    .sort((a, b) => b.pct - a.pct);
  const summary = ids.map((id) => {
    const q = rep.points[id];
    const allowance = layout.points.find((x) => x.id === id)?.allowance;
    return { id, q, three: 3 * q.semiAxesUm[0], allowance, exceeds: allowance !== undefined && 3 * q.semiAxesUm[0] > allowance * toUm };
  });
  return (
    <section className="sheet space-y-3 overflow-x-auto p-4" aria-labelledby="budget-heading" data-testid="repeatability-panel">
      <h2 id="budget-heading" className="text-base">
        Repeatability error budget
      </h2>
      <p className="text-xs text-graphite-soft">
        From each seat&apos;s scatter along its normal (1σ) to the scatter of each functional point.
        {rep.undetermined ? " A free motion remains: scatter along it is not determined." : ""}
      </p>
      {scope.body && !scoped.length ? (
        <p className="text-xs text-graphite-soft" data-testid="filtered-note">
          No functional point on {scope.body}: the budget of every point is shown.
        </p>
      ) : (
        <FilteredNote scope={scope} shown={ids.length} total={allIds.length} what="functional points" />
      )}
      <SortableTable
        testId="repeatability-table"
        rows={summary}
        rowKey={(r) => r.id}
        columns={[
          { key: "id", label: "point", sort: (r) => r.id, render: (r) => r.id },
          { key: "sx", label: "σx (µm)", numeric: true, sort: (r) => r.q.sigmaUm[0], render: (r) => num(r.q.sigmaUm[0]) },
          { key: "sy", label: "σy (µm)", numeric: true, sort: (r) => r.q.sigmaUm[1], render: (r) => num(r.q.sigmaUm[1]) },
          { key: "sz", label: "σz (µm)", numeric: true, sort: (r) => r.q.sigmaUm[2], render: (r) => num(r.q.sigmaUm[2]) },
          againstAllowance<(typeof summary)[number]>("three", "3σ largest semi-axis (µm)", (r) => r.three),
          allowanceColumn(toUm),
        ]}
      />
      <div className="flex flex-wrap items-center gap-2 text-xs">
        <label htmlFor="budget-point">Contributions to the variance at</label>
        <select id="budget-point" className="field w-auto py-1 text-xs" value={pointId} onChange={(e) => setPointId(e.target.value)}>
          {ids.map((id) => (
            <option key={id} value={id}>
              {id}
            </option>
          ))}
        </select>
      </div>
      <div
        className="h-56 w-full"
        data-testid="budget-chart"
        role="img"
        aria-label={`Share of the variance at ${pointId} by contact: ${shares.map((s) => `${s.id} ${s.pct.toFixed(1)} %`).join(", ")}`}
      >
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={shares} layout="vertical" margin={{ left: 24, right: 16 }}>
            <CartesianGrid strokeDasharray="2 3" horizontal={false} />
            <XAxis type="number" unit=" %" domain={[0, 100]} tick={{ fontSize: 10 }} />
            <YAxis type="category" dataKey="id" tick={{ fontSize: 10 }} width={90} />
            <Tooltip formatter={(v) => `${Number(v).toFixed(2)} %`} />
            <Bar dataKey="pct" name="share of variance" fill="#6b3f8a" isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </div>
      <SortableTable
        testId="contribution-table"
        rows={shares}
        rowKey={(r) => r.id}
        initial={{ key: "pct", desc: true }}
        columns={[
          { key: "id", label: "contact", sort: (r) => r.id, render: (r) => r.id },
          { key: "pct", label: "share of variance (%)", numeric: true, sort: (r) => r.pct, render: (r) => num(r.pct, 3) },
        ]}
      />
    </section>
  );
}
