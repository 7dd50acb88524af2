"use client";
/**
 * The layers of one drawing view, one component each: seat features, over-constrained loops, earlier
 * positions, contacts with their normals, seated forces, free-motion axes and the scale bar. Each reads
 * the view's shared context; colours come from the palette.
 */
import type { Layout, Vec3 } from "@/lib/layout/model";
import type { Report } from "@/lib/engine";
import { project, type ViewSpec } from "./projection";
import { palette } from "./palette";
import type { Emphasis } from "./layout-drawings";

export const BODY_SHAPES = ["circle", "square", "triangle", "diamond", "hexagon"] as const;
export type BodyShape = (typeof BODY_SHAPES)[number];

/** What every layer of one view reads. */
export interface ViewContext {
  view: ViewSpec;
  layout: Layout;
  report: Report;
  emphasis?: Emphasis;
  print: boolean;
  show: { motions: boolean; loops: boolean; forces: boolean; foundation: boolean };
  loopContacts: Set<string>;
  bodyShape: Map<string, BodyShape>;
  motions: { m: Report["freeMotions"][number]; i: number }[];
  active: string | null;
  setActive: (id: string | null) => void;
  lengthUnit: string;
  ghosts: { id: string; point: Vec3 }[];
  /** model → SVG */
  px: (p: [number, number]) => [number, number];
  /** model lengths: a normal arrow, and the drawing's extent */
  arrow: number;
  extent: number;
  /** SVG units per model unit */
  scale: number;
  bar: number;
  emph: (id: string) => boolean;
  towardViewer: Vec3;
  /** the visible part of the view (SVG units) and the zoom factor */
  frame: { x: number; y: number; w: number; h: number; zoom: number };
  /** where each label goes (null: left out, it would cover another) — contacts by id, features as "feature:<name>" */
  labels: Map<string, LabelSpot | null>;
}

export interface LabelSpot {
  x: number;
  y: number;
  anchor: "start" | "end";
  box: [number, number, number, number];
}

/** Approximate text box of a label (SVG units): width from the character count, height from the font size. */
export function labelBox(x: number, y: number, text: string, fontSize: number, anchor: "start" | "end"): [number, number, number, number] {
  // generous for the UI face (Inter, upright or italic): digits and capitals run about 0.6–0.65 em wide
  const w = text.length * fontSize * 0.68 + 2;
  return [anchor === "start" ? x - 1 : x - w + 1, y - fontSize * 0.95, w, fontSize * 1.3];
}

const overlaps = (a: [number, number, number, number], b: [number, number, number, number]) =>
  a[0] < b[0] + b[2] && b[0] < a[0] + a[2] && a[1] < b[1] + b[3] && b[1] < a[1] + a[3];

/**
 * Places labels greedily, most important first: each tries a few spots around its anchor point and takes
 * the first whose box covers no label placed before; a label with no free spot is left out (the read-out
 * on hover and the finding's table still name it).
 */
export function placeLabels(
  items: { key: string; x: number; y: number; text: string; fontSize: number; spots: [number, number, "start" | "end"][] }[],
): Map<string, LabelSpot | null> {
  // placed boxes are kept in a grid of 40-unit cells, so a whole instrument's thousands of labels cost
  // a look at the few boxes nearby rather than at every box placed before
  const CELL = 40;
  const grid = new Map<string, [number, number, number, number][]>();
  const cells = (b: [number, number, number, number]) => {
    const keys: string[] = [];
    for (let gx = Math.floor(b[0] / CELL); gx <= Math.floor((b[0] + b[2]) / CELL); gx++)
      for (let gy = Math.floor(b[1] / CELL); gy <= Math.floor((b[1] + b[3]) / CELL); gy++) keys.push(`${gx},${gy}`);
    return keys;
  };
  const out = new Map<string, LabelSpot | null>();
  for (const it of items) {
    let spot: LabelSpot | null = null;
    for (const [dx, dy, anchor] of it.spots) {
      const box = labelBox(it.x + dx, it.y + dy, it.text, it.fontSize, anchor);
      if (!cells(box).some((k) => grid.get(k)?.some((p) => overlaps(p, box)))) {
        spot = { x: it.x + dx, y: it.y + dy, anchor, box };
        break;
      }
    }
    if (spot)
      for (const k of cells(spot.box)) {
        const list = grid.get(k);
        if (list) list.push(spot.box);
        else grid.set(k, [spot.box]);
      }
    out.set(it.key, spot);
  }
  return out;
}

/** The label items of one view: feature names, then contact ids (emphasised contacts first). */
export function labelItems(layout: Layout, view: ViewSpec, px: (p: [number, number]) => [number, number], emph: (id: string) => boolean) {
  const items: Parameters<typeof placeLabels>[0] = [];
  for (const f of [...new Set(layout.contacts.map((c) => c.feature).filter((x): x is string => !!x))]) {
    const { cx, cy, r } = featureCircle(layout, f, view, px);
    items.push({
      key: `feature:${f}`,
      x: cx,
      y: cy,
      text: f,
      fontSize: 8.5,
      spots: [
        [-r * 0.7, r + 10, "start"],
        [-r * 0.7, -r - 4, "start"],
        [r + 3, 3, "start"],
        [-r - 3, 3, "end"],
      ],
    });
  }
  const contacts = [...layout.contacts].sort((a, b) => Number(emph(b.id)) - Number(emph(a.id)));
  for (const c of contacts) {
    const [x, y] = px(project(c.point, view));
    items.push({
      key: c.id,
      x,
      y,
      text: c.id,
      fontSize: 8.5,
      spots: [
        [6, -6, "start"],
        [-6, -6, "end"],
        [6, 13, "start"],
        [-6, 13, "end"],
        [9, 3, "start"],
        [-9, 3, "end"],
      ],
    });
  }
  return items;
}

/** A feature's circle in the view: centre of its contacts and a radius that holds them. */
function featureCircle(layout: Layout, f: string, view: ViewSpec, px: (p: [number, number]) => [number, number]) {
  const q = layout.contacts.filter((c) => c.feature === f).map((c) => px(project(c.point, view)));
  const cx = q.reduce((s, p) => s + p[0], 0) / q.length;
  const cy = q.reduce((s, p) => s + p[1], 0) / q.length;
  const r = Math.max(10, ...q.map(([x, y]) => Math.hypot(x - cx, y - cy) + 8));
  return { cx, cy, r };
}

/** 2-D convex hull (Andrew's monotone chain), counter-clockwise. */
export function convexHull(points: [number, number][]): [number, number][] {
  const p = [...points].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  if (p.length < 3) return p;
  const cross = (o: [number, number], a: [number, number], b: [number, number]) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const lower: [number, number][] = [];
  for (const q of p) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], q) <= 0) lower.pop();
    lower.push(q);
  }
  const upper: [number, number][] = [];
  for (const q of [...p].reverse()) {
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], q) <= 0) upper.pop();
    upper.push(q);
  }
  return [...lower.slice(0, -1), ...upper.slice(0, -1)];
}

/**
 * Body outlines: the convex hull of what the file says about each body — its contacts (either side),
 * functional points, centre of mass and flexure ends — in the view. Not the part's true shape.
 */
export function OutlineLayer({ v, file }: { v: ViewContext; file: Layout }) {
  const { layout, view, px, emph } = v;
  return (
    <>
      {layout.bodies.map((b) => {
        const model: Vec3[] = [
          ...layout.contacts.filter((c) => c.body === b.id || c.on === b.id).map((c) => c.point),
          ...file.points.filter((p) => p.body === b.id).map((p) => p.point),
          ...(b.centerOfMass ? [b.centerOfMass] : []),
          ...(file.flexures ?? []).flatMap((f) =>
            f.body === b.id ? [f.kind === "wire" ? f.to : f.tip] : f.on === b.id ? [f.kind === "wire" ? f.from : f.root] : [],
          ),
        ];
        const hull = convexHull(model.map((p) => px(project(p, view))));
        if (hull.length < 2) return null;
        const strong = layout.contacts.some((c) => (c.body === b.id || c.on === b.id) && emph(c.id));
        return (
          <polygon
            key={b.id}
            data-outline={b.id}
            points={hull.map((p) => p.join(",")).join(" ")}
            fill={palette.outlineFill}
            stroke={palette.outline}
            strokeWidth={0.8}
            strokeLinejoin="round"
            opacity={strong ? 1 : 0.4}
          />
        );
      })}
    </>
  );
}

/** A small arrow head at `to`, pointing from `from`. */
export function arrowPath(from: [number, number], to: [number, number], head = 6): string {
  const [x1, y1] = from;
  const [x2, y2] = to;
  const a = Math.atan2(y2 - y1, x2 - x1);
  return `M${x2},${y2} L${x2 - head * Math.cos(a - 0.4)},${y2 - head * Math.sin(a - 0.4)} L${x2 - head * Math.cos(a + 0.4)},${y2 - head * Math.sin(a + 0.4)} Z`;
}

const unitOf = (v: Vec3) => {
  const l = Math.hypot(...v) || 1;
  return v.map((x) => x / l) as Vec3;
};

/** A body's marker shape at (x, y). */
export function marker(shape: BodyShape, x: number, y: number, r: number, props: React.SVGProps<SVGElement>) {
  const p = props as React.SVGProps<SVGPolygonElement>;
  switch (shape) {
    case "square":
      return <rect x={x - r} y={y - r} width={2 * r} height={2 * r} {...(props as React.SVGProps<SVGRectElement>)} />;
    case "triangle":
      return <polygon points={`${x},${y - r * 1.2} ${x - r * 1.1},${y + r * 0.8} ${x + r * 1.1},${y + r * 0.8}`} {...p} />;
    case "diamond":
      return <polygon points={`${x},${y - r * 1.3} ${x + r * 1.3},${y} ${x},${y + r * 1.3} ${x - r * 1.3},${y}`} {...p} />;
    case "hexagon":
      return (
        <polygon
          points={[0, 1, 2, 3, 4, 5].map((k) => `${x + r * 1.2 * Math.cos((k * Math.PI) / 3)},${y + r * 1.2 * Math.sin((k * Math.PI) / 3)}`).join(" ")}
          {...p}
        />
      );
    default:
      return <circle cx={x} cy={y} r={r} {...(props as React.SVGProps<SVGCircleElement>)} />;
  }
}

/** Seats: a dashed outline around the contacts of each feature, with its name. */
export function FeatureLayer({ v }: { v: ViewContext }) {
  const { layout, view, px, labels } = v;
  return (
    <>
      {[...new Set(layout.contacts.map((c) => c.feature).filter(Boolean))].map((f) => {
        const members = layout.contacts.filter((c) => c.feature === f);
        const q = members.map((c) => px(project(c.point, view)));
        const cx = q.reduce((s, p) => s + p[0], 0) / q.length;
        const cy = q.reduce((s, p) => s + p[1], 0) / q.length;
        const r = Math.max(10, ...q.map(([x, y]) => Math.hypot(x - cx, y - cy) + 8));
        return (
          <g key={f} className="text-graphite-faint">
            <circle cx={cx} cy={cy} r={r} fill="none" stroke="currentColor" strokeWidth={0.6} strokeDasharray="3 2" />
            {labels.get(`feature:${f}`) && (
              <text
                x={labels.get(`feature:${f}`)!.x}
                y={labels.get(`feature:${f}`)!.y}
                textAnchor={labels.get(`feature:${f}`)!.anchor}
                fontSize={8.5}
                fill="currentColor"
                fontStyle="italic"
                data-label={`feature:${f}`}
              >
                {f}
              </text>
            )}
          </g>
        );
      })}
    </>
  );
}

/** Over-constrained loops: the contacts of each self-stress state joined by a thin dashed polygon. */
export function LoopLayer({ v }: { v: ViewContext }) {
  const { layout, report, view, px, show, emph } = v;
  return (
    <>
      {show.loops &&
        report.selfStress.map((s, k) => {
          const ids = Object.keys(s.forces).filter((id) => emph(id));
          const q = ids.map((id) => px(project(layout.contacts.find((c) => c.id === id)!.point, view)));
          if (q.length < 2) return null;
          return (
            <polyline
              key={k}
              points={[...q, q[0]].map((p) => p.join(",")).join(" ")}
              fill="none"
              stroke={palette.conflict}
              strokeWidth={0.8}
              strokeDasharray="2 3"
              data-loop={s.pivot}
            />
          );
        })}
    </>
  );
}

/** Earlier positions of moved contacts (revision diff), joined to where they are now. */
export function GhostLayer({ v }: { v: ViewContext }) {
  const { layout, view, px, ghosts } = v;
  return (
    <>
      {ghosts.map((g) => {
        const now = layout.contacts.find((c) => c.id === g.id);
        const [gx, gy] = px(project(g.point, view));
        const to = now ? px(project(now.point, view)) : null;
        return (
          <g key={`ghost-${g.id}`} data-ghost={g.id}>
            {to && <line x1={gx} y1={gy} x2={to[0]} y2={to[1]} stroke={palette.inkSoft} strokeWidth={0.8} strokeDasharray="1.5 2" />}
            <rect x={gx - 3.5} y={gy - 3.5} width={7} height={7} fill="none" stroke={palette.inkSoft} strokeWidth={1} strokeDasharray="1.5 1" />
            <text x={gx + 5} y={gy + 11} fontSize={8} fill={palette.inkSoft}>
              {g.id} (before)
            </text>
          </g>
        );
      })}
    </>
  );
}

/** Contacts: marker (shape = body), normal arrow or line-of-sight mark, loop ring, lift-off cross, warp sign, label; focus and hover set the read-out. */
export function ContactLayer({ v }: { v: ViewContext }) {
  const { layout, report, view, px, arrow, emph, emphasis, print, show, loopContacts, bodyShape, active, setActive, lengthUnit, towardViewer, labels } = v;
  const warp = report.foundation?.warp?.[0];
  const maxWarp = warp ? Math.max(1e-300, ...Object.values(warp.forces).map(Math.abs)) : 1;
  return (
    <>
      {layout.contacts.map((c) => {
        const [x, y] = px(project(c.point, view));
        const n = unitOf(c.normal);
        const [dx, dy] = project(n, view);
        const inPlane = Math.hypot(dx, dy);
        const tip = px([project(c.point, view)[0] + dx * arrow, project(c.point, view)[1] + dy * arrow]);
        const strong = emph(c.id);
        const inLoop = show.loops && loopContacts.has(c.id);
        const lifted = report.seating?.liftOff.includes(c.id);
        const shape = bodyShape.get(c.body) ?? "circle";
        return (
          <g
            key={c.id}
            tabIndex={print ? undefined : 0}
            role="button"
            aria-label={`contact ${c.id}`}
            data-contact={c.id}
            data-emphasised={emphasis ? String(strong) : undefined}
            opacity={strong ? 1 : 0.3}
            onMouseEnter={() => setActive(c.id)}
            onFocus={() => setActive(c.id)}
            onMouseLeave={() => setActive(null)}
            className="cursor-pointer outline-none focus:[&>*]:stroke-[2.5]"
          >
            <title>{`${c.id}: (${c.point.join(", ")}) ${lengthUnit}`}</title>
            {inPlane > 0.05 ? (
              <>
                <line x1={x} y1={y} x2={tip[0]} y2={tip[1]} stroke={palette.ink} strokeWidth={strong && emphasis ? 1.4 : 0.9} data-normal={c.id} />
                <path d={arrowPath([x, y], tip, 5)} fill={palette.ink} />
              </>
            ) : (
              // normal along the line of sight: a dot (towards the viewer) or a cross (away)
              <g data-normal={c.id}>
                <circle cx={x} cy={y} r={6} fill="none" stroke={palette.ink} strokeWidth={0.8} />
                {n[0] * towardViewer[0] + n[1] * towardViewer[1] + n[2] * towardViewer[2] > 0 ? (
                  <circle cx={x} cy={y} r={1.5} fill={palette.ink} />
                ) : (
                  <path d={`M${x - 3},${y - 3} L${x + 3},${y + 3} M${x - 3},${y + 3} L${x + 3},${y - 3}`} stroke={palette.ink} strokeWidth={0.8} />
                )}
              </g>
            )}
            {marker(shape, x, y, strong && emphasis ? 4.5 : 3.2, {
              fill: active === c.id ? palette.accent : palette.paper,
              stroke: strong && emphasis ? palette.accent : palette.ink,
              strokeWidth: strong && emphasis ? 2 : 1.1,
            })}
            {inLoop && (
              <circle cx={x} cy={y} r={8} fill="none" stroke={palette.conflict} strokeWidth={1.4} strokeDasharray="2.5 1.5" data-loop-contact={c.id} />
            )}
            {lifted && (
              <path
                d={`M${x - 6},${y - 6} L${x + 6},${y + 6} M${x - 6},${y + 6} L${x + 6},${y - 6}`}
                stroke={palette.conflict}
                strokeWidth={1.6}
                data-lifted={c.id}
              />
            )}
            {show.foundation && warp && warp.forces[c.id] !== undefined && Math.abs(warp.forces[c.id]) > 1e-9 * maxWarp && (
              <text x={x + 7} y={y + 12} fontSize={11} fontWeight={700} fill={warp.forces[c.id] > 0 ? palette.accent : palette.conflict} data-warp={c.id}>
                {warp.forces[c.id] > 0 ? "+" : "−"}
              </text>
            )}
            {labels.get(c.id) && (
              <text
                x={labels.get(c.id)!.x}
                y={labels.get(c.id)!.y}
                textAnchor={labels.get(c.id)!.anchor}
                fontSize={8.5}
                fill={palette.inkSoft}
                data-label={c.id}
              >
                {c.id}
              </text>
            )}
          </g>
        );
      })}
    </>
  );
}

/** Seated forces: a bar behind each pushing seat, its length proportional to the force. */
export function ForceLayer({ v }: { v: ViewContext }) {
  const { layout, report, view, px, arrow, show } = v;
  if (!show.forces) return null;
  const maxForce = Math.max(1e-300, ...Object.values(report.seating?.forces ?? {}).map(Math.abs));
  return (
    <>
      {layout.contacts.map((c) => {
        const f = report.seating?.forces?.[c.id];
        if (f === undefined || !(f > 0)) return null;
        const [x, y] = px(project(c.point, view));
        const [dx, dy] = project(unitOf(c.normal), view);
        const tip = px([project(c.point, view)[0] + dx * arrow, project(c.point, view)[1] + dy * arrow]);
        return (
          <g key={c.id} data-force={c.id}>
            <line
              x1={x}
              y1={y}
              x2={x - ((tip[0] - x) * 1.6 * f) / maxForce}
              y2={y - ((tip[1] - y) * 1.6 * f) / maxForce}
              stroke={palette.inkSoft}
              strokeWidth={2.6}
              strokeLinecap="butt"
              opacity={0.75}
            />
          </g>
        );
      })}
    </>
  );
}

/** Free motions: translations as double arrows (a ringed dot end-on), rotation and screw axes as dash-dot lines with a turning arrow. */
export function MotionLayer({ v }: { v: ViewContext }) {
  const { report, view, px, arrow, extent, show, motions, lengthUnit } = v;
  return (
    <>
      {show.motions &&
        motions.map(({ m, i }) =>
          Object.entries(m.screws).map(([b, s]) => {
            if (s.kind === "still" || !s.direction) return null;
            const base = s.point ?? report.scaling.centroid;
            const [ox, oy] = project(base, view);
            const [dx, dy] = project(s.direction, view);
            const len = Math.hypot(dx, dy);
            // motion labels carry a symbol and a bold italic face so they never read as a contact id
            const label = `${s.kind === "translation" ? "⇄ T" : s.kind === "rotation" ? "↻ R" : "↻ S"}${i + 1}${s.kind === "screw" ? ` p=${Number(s.pitch!.toPrecision(3))} ${lengthUnit}/rad` : ""}`;
            if (s.kind === "translation") {
              if (len < 0.05) {
                const [x, y] = px([ox, oy]);
                return (
                  <g key={`${i}-${b}`} data-motion={i} data-kind="translation">
                    <circle cx={x} cy={y} r={11} fill="none" stroke={palette.accent} strokeWidth={2} />
                    <circle cx={x} cy={y} r={2.5} fill={palette.accent} />
                    <text x={x + 13} y={y + 4} fontSize={10} fontWeight={700} fontStyle="italic" fill={palette.accent} data-motion-label="">
                      {label}
                    </text>
                  </g>
                );
              }
              const a = px([ox - (dx / len) * arrow * 1.2, oy - (dy / len) * arrow * 1.2]);
              const z = px([ox + (dx / len) * arrow * 1.2, oy + (dy / len) * arrow * 1.2]);
              return (
                <g key={`${i}-${b}`} data-motion={i} data-kind="translation">
                  <line x1={a[0]} y1={a[1]} x2={z[0]} y2={z[1]} stroke={palette.accent} strokeWidth={2.2} />
                  <path d={arrowPath(a, z, 8)} fill={palette.accent} />
                  <path d={arrowPath(z, a, 8)} fill={palette.accent} />
                  <text x={z[0] + 4} y={z[1] - 4} fontSize={10} fontWeight={700} fontStyle="italic" fill={palette.accent} data-motion-label="">
                    {label}
                  </text>
                </g>
              );
            }
            const [cx, cy] = px([ox, oy]);
            if (len < 0.05) {
              // axis seen end-on: a turning arrow around its trace
              return (
                <g key={`${i}-${b}`} data-motion={i} data-kind={s.kind}>
                  <path d={`M${cx + 14},${cy} A14,14 0 1,1 ${cx},${cy - 14}`} fill="none" stroke={palette.accent} strokeWidth={1.6} />
                  <path d={arrowPath([cx - 4, cy - 15], [cx, cy - 14], 6)} fill={palette.accent} />
                  <path d={`M${cx - 4},${cy} h8 M${cx},${cy - 4} v8`} stroke={palette.accent} strokeWidth={1} />
                  <text x={cx + 16} y={cy + 14} fontSize={10} fontWeight={700} fontStyle="italic" fill={palette.accent} data-motion-label="">
                    {label}
                  </text>
                </g>
              );
            }
            const half = extent * 0.6;
            const a = px([ox - (dx / len) * half, oy - (dy / len) * half]);
            const z = px([ox + (dx / len) * half, oy + (dy / len) * half]);
            const ang = Math.atan2(z[1] - a[1], z[0] - a[0]);
            const mx = z[0] - Math.cos(ang) * 18;
            const my = z[1] - Math.sin(ang) * 18;
            const nx = -Math.sin(ang) * 9;
            const ny = Math.cos(ang) * 9;
            return (
              <g key={`${i}-${b}`} data-motion={i} data-kind={s.kind}>
                <line x1={a[0]} y1={a[1]} x2={z[0]} y2={z[1]} stroke={palette.accent} strokeWidth={1.4} strokeDasharray="10 3 2 3" />
                <path
                  d={`M${mx + nx},${my + ny} Q${mx + Math.cos(ang) * 10},${my + Math.sin(ang) * 10} ${mx - nx},${my - ny}`}
                  fill="none"
                  stroke={palette.accent}
                  strokeWidth={1.4}
                />
                <path d={arrowPath([mx - nx + 2, my - ny + 2], [mx - nx, my - ny], 5)} fill={palette.accent} />
                <text x={z[0] + 3} y={z[1] + 12} fontSize={10} fontWeight={700} fontStyle="italic" fill={palette.accent} data-motion-label="">
                  {label}
                </text>
              </g>
            );
          }),
        )}
    </>
  );
}

/** The scale bar, in the layout's length unit; it stays in the view's lower-left corner when zoomed or panned. */
export function ScaleBar({ v }: { v: ViewContext }) {
  const { bar, scale, lengthUnit, frame } = v;
  const k = 1 / frame.zoom;
  return (
    <>
      <g transform={`translate(${frame.x + 14 * k},${frame.y + frame.h - 14 * k}) scale(${k})`} fontSize={9} fill={palette.inkSoft} data-scale-bar="">
        <line x1={0} y1={0} x2={bar * scale * frame.zoom} y2={0} stroke={palette.ink} strokeWidth={1.2} />
        <line x1={0} y1={-4} x2={0} y2={4} stroke={palette.ink} />
        <line x1={bar * scale * frame.zoom} y1={-4} x2={bar * scale * frame.zoom} y2={4} stroke={palette.ink} />
        <text x={bar * scale * frame.zoom + 5} y={3} data-testid="scale-bar">
          {Number(bar.toPrecision(3))} {lengthUnit}
        </text>
      </g>
    </>
  );
}
