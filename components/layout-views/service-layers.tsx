/**
 * Drawing layers for flexure elements (wires as lines, blades as thin rectangles), thermal centres and
 * point drift, and the 3σ repeatability ellipse of each functional point (analysis.md §9–§11).
 */
import type { Layout, Vec3 } from "@/lib/layout/model";
import type { Report } from "@/lib/engine";
import { bladeFrame } from "@/lib/layout/flexures";
import { project, type ViewSpec } from "./projection";
import { palette } from "./palette";

type Px = (p: [number, number]) => [number, number];

interface LayerProps {
  view: ViewSpec;
  px: Px;
  emph: (id: string) => boolean;
}

/** Labels of per-body and per-point marks beyond this many are left off unless their body is in focus. */
const LABELLED_MARKS = 30;

/** Wires as lines from end to end; blades as thin rectangles (root edge, tip edge, width). */
export function FlexureLayer({ layout, view, px, emph }: LayerProps & { layout: Layout }) {
  const pt = (p: Vec3) => px(project(p, view));
  return (
    <g data-layer="flexures">
      {(layout.flexures ?? []).map((f) => {
        const strong = f.kind === "wire" ? emph(f.id) : ["a", "b", "s"].some((r) => emph(`${f.id}.${r}`));
        if (f.kind === "wire") {
          const [a, b] = [pt(f.from), pt(f.to)];
          return (
            <g key={f.id} data-flexure={f.id} data-kind="wire" opacity={strong ? 1 : 0.3}>
              <line x1={a[0]} y1={a[1]} x2={b[0]} y2={b[1]} stroke={palette.flexure} strokeWidth={1.6} />
              <circle cx={a[0]} cy={a[1]} r={2} fill={palette.flexure} />
            </g>
          );
        }
        const frame = bladeFrame(f);
        if (!frame) return null;
        const h = frame.w.map((x) => (x * f.width) / 2) as Vec3;
        const corners = [
          [f.root[0] + h[0], f.root[1] + h[1], f.root[2] + h[2]],
          [f.tip[0] + h[0], f.tip[1] + h[1], f.tip[2] + h[2]],
          [f.tip[0] - h[0], f.tip[1] - h[1], f.tip[2] - h[2]],
          [f.root[0] - h[0], f.root[1] - h[1], f.root[2] - h[2]],
        ].map((p) => pt(p as Vec3));
        const [r1, , , r2] = corners;
        return (
          <g key={f.id} data-flexure={f.id} data-kind="blade" opacity={strong ? 1 : 0.3}>
            <polygon points={corners.map((p) => p.join(",")).join(" ")} fill={palette.flexureFill} stroke={palette.flexure} strokeWidth={1.1} />
            {/* the clamped root edge, hatched */}
            <line x1={r1[0]} y1={r1[1]} x2={r2[0]} y2={r2[1]} stroke={palette.flexure} strokeWidth={2.6} />
          </g>
        );
      })}
    </g>
  );
}

/** Thermal centre of each body (a ringed cross) and each point's drift direction per kelvin. */
export function ThermalLayer({
  report,
  layout,
  view,
  px,
  arrow,
  bodyEmph,
}: LayerProps & { report: Report; layout: Layout; arrow: number; bodyEmph: (bodyId: string) => boolean }) {
  const t = report.thermal;
  if (!t) return null;
  const many = Object.values(t.bodies).filter((b) => b.centre).length > LABELLED_MARKS;
  const maxDrift = Math.max(1e-300, ...Object.values(t.points).map((p) => Math.hypot(...p.driftUmPerK)));
  return (
    <g data-layer="thermal">
      {Object.entries(t.bodies).map(([id, b]) => {
        if (!b.centre) return null;
        const [x, y] = px(project(b.centre, view));
        const strong = bodyEmph(id);
        return (
          <g key={id} data-thermal-centre={id} opacity={strong ? 1 : 0.25}>
            <circle cx={x} cy={y} r={7} fill="none" stroke={palette.thermal} strokeWidth={1.4} />
            <path d={`M${x - 10},${y} h20 M${x},${y - 10} v20`} stroke={palette.thermal} strokeWidth={1} />
            <circle cx={x} cy={y} r={2} fill={palette.thermal} />
            {strong && !(many && bodyEmph("")) && <text x={x + 9} y={y + 14} fontSize={8.5} fill={palette.thermal}>{`TC ${id}`}</text>}
          </g>
        );
      })}
      {layout.points.map((p) => {
        const d = t.points[p.id]?.driftUmPerK;
        if (!d) return null;
        const [dx, dy] = project(d, view);
        const k = (arrow * 1.2) / maxDrift;
        const [q0, q1] = project(p.point, view);
        const a = px([q0, q1]);
        const z = px([q0 + dx * k, q1 + dy * k]);
        if (Math.hypot(z[0] - a[0], z[1] - a[1]) < 2) return null;
        const ang = Math.atan2(z[1] - a[1], z[0] - a[0]);
        return (
          <g key={p.id} data-drift={p.id}>
            <line x1={a[0]} y1={a[1]} x2={z[0]} y2={z[1]} stroke={palette.thermal} strokeWidth={1.3} strokeDasharray="4 2" />
            <path
              d={`M${z[0]},${z[1]} l${-6 * Math.cos(ang - 0.45)},${-6 * Math.sin(ang - 0.45)} l${6 * Math.cos(ang - 0.45) - 6 * Math.cos(ang + 0.45)},${6 * Math.sin(ang - 0.45) - 6 * Math.sin(ang + 0.45)} z`}
              fill={palette.thermal}
            />
          </g>
        );
      })}
    </g>
  );
}

/** Projects a 3 × 3 covariance given by semi-axes and axes onto the view: the 2 × 2 covariance. */
export function projectedCovariance(semi: Vec3, axes: [Vec3, Vec3, Vec3], view: ViewSpec): [number, number, number] {
  let [cxx, cxy, cyy] = [0, 0, 0];
  for (let i = 0; i < 3; i++) {
    const [a, b] = project(axes[i], view);
    const s2 = semi[i] * semi[i];
    cxx += s2 * a * a;
    cxy += s2 * a * b;
    cyy += s2 * b * b;
  }
  return [cxx, cxy, cyy];
}

/** Largest 3σ semi-axis over all points (µm), the reference the ellipses are drawn to; null without results. */
export function largestThreeSigmaUm(report: Report): number | null {
  const rep = report.repeatability;
  if (!rep) return null;
  const big = Math.max(0, ...Object.values(rep.points).map((p) => 3 * p.semiAxesUm[0]));
  return big > 0 ? big : null;
}

/**
 * Each functional point, and its 3σ repeatability ellipse (projected), magnified so that the largest
 * 3σ semi-axis of the layout is `refPx` long on screen.
 */
export function PointLayer({
  report,
  layout,
  view,
  px,
  refPx,
  bodyEmph,
}: LayerProps & { report: Report; layout: Layout; refPx: number; bodyEmph: (bodyId: string) => boolean }) {
  const rep = report.repeatability;
  const refUm = largestThreeSigmaUm(report);
  const many = layout.points.length > LABELLED_MARKS;
  return (
    <g data-layer="points">
      {layout.points.map((p) => {
        const [x, y] = px(project(p.point, view));
        const r = rep?.points[p.id];
        let ellipse = null;
        if (r && refUm) {
          const [cxx, cxy, cyy] = projectedCovariance(r.semiAxesUm, r.axes, view);
          const tr = (cxx + cyy) / 2;
          const disc = Math.sqrt(Math.max(0, ((cxx - cyy) / 2) ** 2 + cxy * cxy));
          const rx = ((3 * Math.sqrt(Math.max(0, tr + disc))) / refUm) * refPx;
          const ry = ((3 * Math.sqrt(Math.max(0, tr - disc))) / refUm) * refPx;
          // SVG y points down: the angle of the model-up frame is mirrored
          const ang = (Math.atan2(2 * cxy, cxx - cyy) / 2) * (180 / Math.PI);
          ellipse = (
            <ellipse
              cx={x}
              cy={y}
              rx={Math.max(rx, 0.6)}
              ry={Math.max(ry, 0.6)}
              transform={`rotate(${-ang} ${x} ${y})`}
              fill="none"
              stroke={palette.repeatability}
              strokeWidth={1.2}
              data-ellipse={p.id}
            />
          );
        }
        const strong = bodyEmph(p.body);
        return (
          <g key={p.id} data-point={p.id} opacity={strong ? 1 : 0.25}>
            <path d={`M${x - 5},${y} h10 M${x},${y - 5} v10`} stroke={palette.ink} strokeWidth={1} />
            <rect x={x - 2.5} y={y - 2.5} width={5} height={5} fill="none" stroke={palette.ink} strokeWidth={0.8} transform={`rotate(45 ${x} ${y})`} />
            {ellipse}
            {strong && !(many && bodyEmph("")) && (
              <text x={x + 6} y={y + 12} fontSize={8.5} fill={palette.ink} fontStyle="italic">
                {p.id}
              </text>
            )}
          </g>
        );
      })}
    </g>
  );
}
