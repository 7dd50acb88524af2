"use client";
/**
 * The four drawing views of a layout (plan, front, side, axonometric) with its findings drawn on them:
 * contacts with normal arrows, free motions as screw axes, over-constrained loops, seated forces,
 * lift-offs and, on demand, the foundation-coupling response. Shapes and line styles carry the meaning,
 * so the drawing holds in black and white and for colour-blind readers.
 */
import { useMemo, useRef, useState } from "react";
import type { Layout, Vec3 } from "@/lib/layout/model";
import type { Report } from "@/lib/engine";
import { expandFlexures, flexureLength } from "@/lib/layout/flexures";
import { fitPoints, project, scaleBarLength, toSvg, views, type Fit, type ViewSpec } from "./projection";
import { FlexureLayer, PointLayer, ThermalLayer, largestThreeSigmaUm } from "./service-layers";
import { palette } from "./palette";
import { num } from "@/lib/analysis/format";

export interface Emphasis {
  /** contacts to emphasise; others are drawn faint */
  contacts: string[];
  /** indices of free motions to draw (all when undefined) */
  motions?: number[];
  /** draw the least-constrained direction */
  weakest?: boolean;
}

interface Props {
  layout: Layout;
  report: Report;
  emphasis?: Emphasis;
  /** printable: no controls, fixed layout */
  print?: boolean;
  /** earlier positions of moved contacts (revision diff): drawn hollow, joined to the new position */
  ghosts?: { id: string; point: Vec3 }[];
}

const W = 420;
const H = 300;
const BODY_SHAPES = ["circle", "square", "triangle", "diamond", "hexagon"] as const;

function marker(shape: (typeof BODY_SHAPES)[number], x: number, y: number, r: number, props: React.SVGProps<SVGElement>) {
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

const unitOf = (v: Vec3) => {
  const l = Math.hypot(...v) || 1;
  return v.map((x) => x / l) as Vec3;
};

/** What a reader sees of one flexure row on hover or focus: kind, dimensions and stiffness. */
export function flexureReadout(file: Layout, rowId: string, row: Layout["contacts"][number] | undefined, lengthUnit: string, forceUnit: string): string {
  const f = (file.flexures ?? []).find((x) => x.id === row?.flexure);
  if (!f || !row) return "";
  const dims =
    f.kind === "wire"
      ? `length ${Number(flexureLength(f).toPrecision(4))} ${lengthUnit}${f.diameter !== undefined ? `, diameter ${f.diameter} ${lengthUnit}` : ""}`
      : `length ${Number(flexureLength(f).toPrecision(4))} ${lengthUnit}, width ${f.width} ${lengthUnit}${f.thickness !== undefined ? `, thickness ${f.thickness} ${lengthUnit}` : ""}`;
  const k =
    row.stiffness !== undefined ? `, stiffness ${num(row.stiffness, 5)} ${forceUnit}/${lengthUnit}` : ", no stiffness (material modulus or section missing)";
  return ` · ${f.kind} ${f.id}${rowId === f.id ? "" : ` (row ${rowId.slice(f.id.length + 1)})`}: ${dims}${f.material ? `, ${f.material}` : ""}${k}`;
}

export function LayoutDrawings({ layout: file, report, emphasis, print = false, ghosts = [] }: Props) {
  // flexure elements are drawn as elements and their generated rows as contacts (analysis.md §10)
  const layout = useMemo(() => expandFlexures(file), [file]);
  const [showMotions, setShowMotions] = useState(true);
  const [showLoops, setShowLoops] = useState(true);
  const [showForces, setShowForces] = useState(!!report.seating?.forces);
  const [showFoundation, setShowFoundation] = useState(false);
  const [active, setActive] = useState<string | null>(null);
  const lengthUnit = layout.units.length === "um" ? "µm" : layout.units.length;
  const forceUnit = layout.units.force;

  const loopContacts = useMemo(() => new Set(report.selfStress.flatMap((s) => Object.keys(s.forces))), [report]);
  const bodyShape = useMemo(() => new Map(layout.bodies.map((b, i) => [b.id, BODY_SHAPES[i % BODY_SHAPES.length]])), [layout]);
  const warp = report.foundation?.warp?.[0];
  const activeContact = layout.contacts.find((c) => c.id === active);
  const motions = report.freeMotions.map((m, i) => ({ m, i })).filter(({ i }) => !emphasis?.motions || emphasis.motions.includes(i));

  const description = [
    `${layout.contacts.length} contacts on ${layout.bodies.length} bod${layout.bodies.length === 1 ? "y" : "ies"}, drawn with their normals`,
    motions.length ? `${motions.length} free motion${motions.length === 1 ? "" : "s"} drawn as screw axes` : "no free motion",
    report.selfStressDimension
      ? `${report.selfStressDimension} over-constrained loop${report.selfStressDimension === 1 ? "" : "s"} marked on contacts ${[...loopContacts].join(", ")}`
      : "no over-constrained loop",
    emphasis ? `emphasised: ${emphasis.contacts.join(", ") || "the motions of this finding"}` : "",
  ].filter(Boolean);

  return (
    <figure className="sheet p-3" data-testid="layout-drawings" aria-label="Drawing views of the layout">
      {!print && (
        <div className="no-print mb-2 flex flex-wrap gap-4 text-xs">
          <label className="flex items-center gap-1">
            <input type="checkbox" checked={showMotions} onChange={(e) => setShowMotions(e.target.checked)} /> free motions
          </label>
          <label className="flex items-center gap-1">
            <input type="checkbox" checked={showLoops} onChange={(e) => setShowLoops(e.target.checked)} /> over-constrained loops
          </label>
          {report.seating?.forces && (
            <label className="flex items-center gap-1">
              <input type="checkbox" checked={showForces} onChange={(e) => setShowForces(e.target.checked)} /> seated forces
            </label>
          )}
          {warp && (
            <label className="flex items-center gap-1">
              <input type="checkbox" checked={showFoundation} onChange={(e) => setShowFoundation(e.target.checked)} /> response to 1 µm base warp
            </label>
          )}
        </div>
      )}
      <div className="grid gap-3 lg:grid-cols-2">
        {views.map((v) => (
          <OneView
            key={v.name}
            view={v}
            layout={layout}
            file={file}
            report={report}
            emphasis={emphasis}
            print={print}
            show={{ motions: showMotions, loops: showLoops, forces: showForces, foundation: showFoundation }}
            loopContacts={loopContacts}
            bodyShape={bodyShape}
            motions={motions}
            active={active}
            setActive={setActive}
            lengthUnit={lengthUnit}
            ghosts={ghosts}
          />
        ))}
      </div>
      <div className="mt-2 min-h-[2.5rem] text-xs" aria-live="polite" data-testid="contact-info">
        {activeContact ? (
          <span className="num">
            <b>{activeContact.id}</b> ({activeContact.body} on {activeContact.on}
            {activeContact.feature ? `, ${activeContact.feature}` : ""}) · point ({activeContact.point.map((x) => Number(x.toPrecision(6))).join(", ")}){" "}
            {lengthUnit} · normal (
            {unitOf(activeContact.normal)
              .map((x) => x.toFixed(3))
              .join(", ")}
            ){flexureReadout(file, activeContact.id, activeContact, lengthUnit, forceUnit)}
            {report.seating?.forces ? ` · seated force ${report.seating.forces[activeContact.id]?.toPrecision(4)} ${forceUnit}` : ""}
            {report.seating?.liftOff.includes(activeContact.id) ? " · lifted off" : ""}
          </span>
        ) : (
          <span className="text-graphite-soft">Point at or tab to a contact to read its coordinates, normal and seated force.</span>
        )}
      </div>
      {!emphasis && (
        <Legend
          hasForces={!!report.seating?.forces}
          hasFlexures={(file.flexures ?? []).length > 0}
          hasPoints={file.points.length > 0}
          hasThermal={!!report.thermal}
          threeSigmaUm={largestThreeSigmaUm(report)}
        />
      )}
      <figcaption className="mt-2 text-xs text-graphite-soft">
        <details>
          <summary>What is drawn</summary>
          <ul className="ml-4 list-disc">
            {description.map((d) => (
              <li key={d}>{d}</li>
            ))}
            {motions.map(({ m, i }) =>
              Object.entries(m.screws)
                .filter(([, s]) => s.kind !== "still")
                .map(([b, s]) => (
                  <li key={`${i}-${b}`}>
                    motion {i + 1}, {b}: {s.kind} along ({s.direction!.map((x) => x.toFixed(3)).join(", ")})
                    {s.point ? ` through (${s.point.map((x) => Number(x.toPrecision(4))).join(", ")}) ${lengthUnit}` : ""}
                    {s.kind === "screw" ? `, pitch ${Number(s.pitch!.toPrecision(3))} ${lengthUnit}/rad` : ""}
                  </li>
                )),
            )}
          </ul>
        </details>
      </figcaption>
    </figure>
  );
}

function Legend({
  hasForces,
  hasFlexures,
  hasPoints,
  hasThermal,
  threeSigmaUm,
}: {
  hasForces: boolean;
  hasFlexures: boolean;
  hasPoints: boolean;
  hasThermal: boolean;
  threeSigmaUm: number | null;
}) {
  return (
    <div className="mt-2 flex flex-wrap gap-x-5 gap-y-1 text-xs text-graphite-soft" data-testid="drawing-legend">
      <span>
        <svg width="30" height="10" aria-hidden="true">
          <circle cx="5" cy="5" r="3" fill="none" stroke="currentColor" />
          <line x1="9" y1="5" x2="28" y2="5" stroke="currentColor" />
          <path d="M28 5 l-4 -2.5 v5 z" fill="currentColor" />
        </svg>{" "}
        contact and its normal (marker shape = body)
      </span>
      <span>
        <svg width="30" height="10" aria-hidden="true">
          <line x1="2" y1="5" x2="28" y2="5" stroke="#0f5b5c" strokeWidth="2.2" />
          <path d="M28 5 l-5 -3 v6 z" fill="#0f5b5c" />
        </svg>{" "}
        free translation
      </span>
      <span>
        <svg width="30" height="10" aria-hidden="true">
          <line x1="2" y1="5" x2="28" y2="5" stroke="#0f5b5c" strokeWidth="1.4" strokeDasharray="8 3 2 3" />
        </svg>{" "}
        rotation or screw axis (turning arrow; pitch noted)
      </span>
      <span>
        <svg width="30" height="10" aria-hidden="true">
          <circle cx="15" cy="5" r="4" fill="none" stroke="#a3271f" strokeWidth="1.6" strokeDasharray="2 1.5" />
        </svg>{" "}
        contact in an over-constrained loop
      </span>
      {hasForces && (
        <span>
          <svg width="30" height="10" aria-hidden="true">
            <line x1="2" y1="5" x2="26" y2="5" stroke="currentColor" strokeWidth="3" />
          </svg>{" "}
          seated force (length ∝ force); × lifted off
        </span>
      )}
      {hasFlexures && (
        <span>
          <svg width="30" height="10" aria-hidden="true">
            <rect x="2" y="3" width="26" height="4" fill={palette.flexureFill} stroke={palette.flexure} />
            <line x1="2" y1="2" x2="2" y2="8" stroke={palette.flexure} strokeWidth="2.6" />
          </svg>{" "}
          blade (thick edge: root) ·{" "}
          <svg width="20" height="10" aria-hidden="true">
            <line x1="2" y1="5" x2="18" y2="5" stroke={palette.flexure} strokeWidth="1.6" />
          </svg>{" "}
          wire
        </span>
      )}
      {hasPoints && (
        <span>
          <svg width="14" height="10" aria-hidden="true">
            <path d="M2 5 h10 M7 0 v10" stroke="currentColor" />
          </svg>{" "}
          functional point
        </span>
      )}
      {hasThermal && (
        <span>
          <svg width="22" height="14" aria-hidden="true">
            <circle cx="11" cy="7" r="5" fill="none" stroke={palette.thermal} strokeWidth="1.4" />
            <path d="M3 7 h16 M11 0 v14" stroke={palette.thermal} />
          </svg>{" "}
          thermal centre (TC) ·{" "}
          <svg width="26" height="10" aria-hidden="true">
            <line x1="2" y1="5" x2="22" y2="5" stroke={palette.thermal} strokeDasharray="4 2" />
            <path d="M24 5 l-5 -3 v6 z" fill={palette.thermal} />
          </svg>{" "}
          drift direction per K
        </span>
      )}
      {threeSigmaUm !== null && (
        <span>
          <svg width="26" height="12" aria-hidden="true">
            <ellipse cx="13" cy="6" rx="11" ry="4" fill="none" stroke={palette.repeatability} strokeWidth="1.2" />
          </svg>{" "}
          3σ repeatability ellipse, magnified: the largest is drawn as long as a normal arrow and stands for {threeSigmaUm.toPrecision(3)} µm
        </span>
      )}
    </div>
  );
}

interface OneViewProps {
  view: ViewSpec;
  layout: Layout;
  /** the layout as in the file (flexure elements, points) */
  file: Layout;
  report: Report;
  emphasis?: Emphasis;
  print: boolean;
  show: { motions: boolean; loops: boolean; forces: boolean; foundation: boolean };
  loopContacts: Set<string>;
  bodyShape: Map<string, (typeof BODY_SHAPES)[number]>;
  motions: { m: Report["freeMotions"][number]; i: number }[];
  active: string | null;
  setActive: (id: string | null) => void;
  lengthUnit: string;
  ghosts: { id: string; point: Vec3 }[];
}

function OneView({ view, layout, file, report, emphasis, print, show, loopContacts, bodyShape, motions, active, setActive, lengthUnit, ghosts }: OneViewProps) {
  const [zoom, setZoom] = useState(1);
  const [pan, setPan] = useState<[number, number]>([0, 0]);
  const drag = useRef<[number, number] | null>(null);
  // the frame follows the revision shown (contacts, flexure ends, points, thermal centres, earlier positions)
  const fit: Fit = useMemo(() => {
    const model: Vec3[] = [
      ...layout.contacts.map((c) => c.point),
      ...(file.flexures ?? []).flatMap((f) => (f.kind === "wire" ? [f.from, f.to] : [f.root, f.tip])),
      ...file.points.map((p) => p.point),
      ...Object.values(report.thermal?.bodies ?? {}).flatMap((b) => (b.centre ? [b.centre] : [])),
      ...ghosts.map((g) => g.point),
    ];
    const pts = model.map((p) => project(p, view));
    return fitPoints(pts.length ? pts : [[0, 0]], W, H, 40);
  }, [layout, file, report, ghosts, view]);
  const extent = Math.max((W - 80) / fit.scale, 1e-9);
  const arrow = extent * 0.09;
  const px = (p: [number, number]) => toSvg(fit, p);
  const maxForce = Math.max(1e-300, ...Object.values(report.seating?.forces ?? {}).map(Math.abs));
  const warp = report.foundation?.warp?.[0];
  const maxWarp = warp ? Math.max(1e-300, ...Object.values(warp.forces).map(Math.abs)) : 1;
  const bar = scaleBarLength(fit);
  const emph = (id: string) => !emphasis || emphasis.contacts.includes(id);
  const [r, u] = [view.right, view.up];
  const towardViewer: Vec3 = [r[1] * u[2] - r[2] * u[1], r[2] * u[0] - r[0] * u[2], r[0] * u[1] - r[1] * u[0]];
  const vb = `${(W / 2) * (1 - 1 / zoom) - pan[0]} ${(H / 2) * (1 - 1 / zoom) - pan[1]} ${W / zoom} ${H / zoom}`;

  const arrowPath = (from: [number, number], to: [number, number], head = 6) => {
    const [x1, y1] = from;
    const [x2, y2] = to;
    const a = Math.atan2(y2 - y1, x2 - x1);
    return `M${x2},${y2} L${x2 - head * Math.cos(a - 0.4)},${y2 - head * Math.sin(a - 0.4)} L${x2 - head * Math.cos(a + 0.4)},${y2 - head * Math.sin(a + 0.4)} Z`;
  };

  return (
    <div className="relative">
      <div className="mb-1 flex items-baseline gap-2 text-xs">
        <span className="font-semibold">{view.title}</span>
        <span className="text-graphite-soft">{view.projection}</span>
        {!print && (
          <span className="no-print ml-auto flex gap-1">
            <button type="button" className="btn-quiet px-1.5 py-0" aria-label={`Zoom in ${view.title}`} onClick={() => setZoom((z) => Math.min(z * 1.4, 20))}>
              +
            </button>
            <button
              type="button"
              className="btn-quiet px-1.5 py-0"
              aria-label={`Zoom out ${view.title}`}
              onClick={() => setZoom((z) => Math.max(z / 1.4, 0.5))}
            >
              −
            </button>
            <button
              type="button"
              className="btn-quiet px-1.5 py-0"
              aria-label={`Fit ${view.title}`}
              onClick={() => {
                setZoom(1);
                setPan([0, 0]);
              }}
            >
              fit
            </button>
          </span>
        )}
      </div>
      <svg
        viewBox={vb}
        width="100%"
        role="img"
        aria-label={`${view.title} view (${view.projection}) of ${layout.contacts.length} contacts`}
        className="h-auto w-full touch-none select-none rounded-sm border border-paper-line bg-[#fdfbf6]"
        data-view={view.name}
        onWheel={(e) => {
          if (print) return;
          e.preventDefault();
          setZoom((z) => Math.min(Math.max(z * (e.deltaY < 0 ? 1.15 : 1 / 1.15), 0.5), 20));
        }}
        onPointerDown={(e) => {
          if (!print) drag.current = [e.clientX, e.clientY];
        }}
        onPointerMove={(e) => {
          if (!drag.current) return;
          const [x0, y0] = drag.current;
          drag.current = [e.clientX, e.clientY];
          const k = W / ((e.currentTarget.clientWidth || W) * zoom);
          setPan(([a, b]) => [a + (e.clientX - x0) * k, b + (e.clientY - y0) * k]);
        }}
        onPointerUp={() => (drag.current = null)}
        onPointerLeave={() => (drag.current = null)}
      >
        {/* features: dashed outline around grouped contacts and a label */}
        {[...new Set(layout.contacts.map((c) => c.feature).filter(Boolean))].map((f) => {
          const members = layout.contacts.filter((c) => c.feature === f);
          const q = members.map((c) => px(project(c.point, view)));
          const cx = q.reduce((s, p) => s + p[0], 0) / q.length;
          const cy = q.reduce((s, p) => s + p[1], 0) / q.length;
          const r = Math.max(10, ...q.map(([x, y]) => Math.hypot(x - cx, y - cy) + 8));
          return (
            <g key={f} className="text-graphite-faint">
              <circle cx={cx} cy={cy} r={r} fill="none" stroke="currentColor" strokeWidth={0.6} strokeDasharray="3 2" />
              <text x={cx - r * 0.7} y={cy + r + 10} fontSize={8.5} fill="currentColor" fontStyle="italic">
                {f}
              </text>
            </g>
          );
        })}

        {/* loops: contacts of each self-stress state joined by a thin dashed polygon */}
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
                stroke="#a3271f"
                strokeWidth={0.8}
                strokeDasharray="2 3"
                data-loop={s.pivot}
              />
            );
          })}

        {/* earlier positions of moved contacts (revision diff) */}
        {ghosts.map((g) => {
          const now = layout.contacts.find((c) => c.id === g.id);
          const [gx, gy] = px(project(g.point, view));
          const to = now ? px(project(now.point, view)) : null;
          return (
            <g key={`ghost-${g.id}`} data-ghost={g.id}>
              {to && <line x1={gx} y1={gy} x2={to[0]} y2={to[1]} stroke="#55595d" strokeWidth={0.8} strokeDasharray="1.5 2" />}
              <rect x={gx - 3.5} y={gy - 3.5} width={7} height={7} fill="none" stroke="#55595d" strokeWidth={1} strokeDasharray="1.5 1" />
              <text x={gx + 5} y={gy + 11} fontSize={8} fill="#55595d">
                {g.id} (before)
              </text>
            </g>
          );
        })}

        <FlexureLayer layout={file} view={view} px={px} emph={emph} />

        {/* contacts */}
        {layout.contacts.map((c) => {
          const [x, y] = px(project(c.point, view));
          const n = unitOf(c.normal);
          const [dx, dy] = project(n, view);
          const inPlane = Math.hypot(dx, dy);
          const tip = px([project(c.point, view)[0] + dx * arrow, project(c.point, view)[1] + dy * arrow]);
          const strong = emph(c.id);
          const inLoop = show.loops && loopContacts.has(c.id);
          const lifted = report.seating?.liftOff.includes(c.id);
          const f = report.seating?.forces?.[c.id];
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
                  <line x1={x} y1={y} x2={tip[0]} y2={tip[1]} stroke="#2b2d2f" strokeWidth={strong && emphasis ? 1.4 : 0.9} data-normal={c.id} />
                  <path d={arrowPath([x, y], tip, 5)} fill="#2b2d2f" />
                </>
              ) : (
                // normal along the line of sight: a dot (towards the viewer) or a cross (away)
                <g data-normal={c.id}>
                  <circle cx={x} cy={y} r={6} fill="none" stroke="#2b2d2f" strokeWidth={0.8} />
                  {n[0] * towardViewer[0] + n[1] * towardViewer[1] + n[2] * towardViewer[2] > 0 ? (
                    <circle cx={x} cy={y} r={1.5} fill="#2b2d2f" />
                  ) : (
                    <path d={`M${x - 3},${y - 3} L${x + 3},${y + 3} M${x - 3},${y + 3} L${x + 3},${y - 3}`} stroke="#2b2d2f" strokeWidth={0.8} />
                  )}
                </g>
              )}
              {marker(shape, x, y, strong && emphasis ? 4.5 : 3.2, {
                fill: active === c.id ? "#0f5b5c" : "#fdfbf6",
                stroke: strong && emphasis ? "#0f5b5c" : "#2b2d2f",
                strokeWidth: strong && emphasis ? 2 : 1.1,
              })}
              {inLoop && <circle cx={x} cy={y} r={8} fill="none" stroke="#a3271f" strokeWidth={1.4} strokeDasharray="2.5 1.5" data-loop-contact={c.id} />}
              {show.forces && f !== undefined && f > 0 && (
                <g data-force={c.id}>
                  <line
                    x1={x}
                    y1={y}
                    x2={x - ((tip[0] - x) * 1.6 * f) / maxForce}
                    y2={y - ((tip[1] - y) * 1.6 * f) / maxForce}
                    stroke="#55595d"
                    strokeWidth={2.6}
                    strokeLinecap="butt"
                    opacity={0.75}
                  />
                </g>
              )}
              {lifted && (
                <path d={`M${x - 6},${y - 6} L${x + 6},${y + 6} M${x - 6},${y + 6} L${x + 6},${y - 6}`} stroke="#a3271f" strokeWidth={1.6} data-lifted={c.id} />
              )}
              {show.foundation && warp && warp.forces[c.id] !== undefined && Math.abs(warp.forces[c.id]) > 1e-9 * maxWarp && (
                <text x={x + 7} y={y + 12} fontSize={11} fontWeight={700} fill={warp.forces[c.id] > 0 ? "#0f5b5c" : "#a3271f"} data-warp={c.id}>
                  {warp.forces[c.id] > 0 ? "+" : "−"}
                </text>
              )}
              <text x={x + 6} y={y - 6} fontSize={8.5} fill="#55595d">
                {c.id}
              </text>
            </g>
          );
        })}

        <PointLayer layout={file} report={report} view={view} px={px} emph={emph} refPx={arrow * fit.scale} />
        <ThermalLayer layout={file} report={report} view={view} px={px} emph={emph} arrow={arrow} />

        {/* free motions */}
        {show.motions &&
          motions.map(({ m, i }) =>
            Object.entries(m.screws).map(([b, s]) => {
              if (s.kind === "still" || !s.direction) return null;
              const base = s.point ?? report.scaling.centroid;
              const [ox, oy] = project(base, view);
              const [dx, dy] = project(s.direction, view);
              const len = Math.hypot(dx, dy);
              const label = `${s.kind === "translation" ? "T" : s.kind === "rotation" ? "R" : "S"}${i + 1}${s.kind === "screw" ? ` p=${Number(s.pitch!.toPrecision(3))} ${lengthUnit}/rad` : ""}`;
              if (s.kind === "translation") {
                if (len < 0.05) {
                  const [x, y] = px([ox, oy]);
                  return (
                    <g key={`${i}-${b}`} data-motion={i} data-kind="translation">
                      <circle cx={x} cy={y} r={11} fill="none" stroke="#0f5b5c" strokeWidth={2} />
                      <circle cx={x} cy={y} r={2.5} fill="#0f5b5c" />
                      <text x={x + 13} y={y + 4} fontSize={10} fill="#0f5b5c">
                        {label}
                      </text>
                    </g>
                  );
                }
                const a = px([ox - (dx / len) * arrow * 1.2, oy - (dy / len) * arrow * 1.2]);
                const z = px([ox + (dx / len) * arrow * 1.2, oy + (dy / len) * arrow * 1.2]);
                return (
                  <g key={`${i}-${b}`} data-motion={i} data-kind="translation">
                    <line x1={a[0]} y1={a[1]} x2={z[0]} y2={z[1]} stroke="#0f5b5c" strokeWidth={2.2} />
                    <path d={arrowPath(a, z, 8)} fill="#0f5b5c" />
                    <path d={arrowPath(z, a, 8)} fill="#0f5b5c" />
                    <text x={z[0] + 4} y={z[1] - 4} fontSize={10} fill="#0f5b5c">
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
                    <path d={`M${cx + 14},${cy} A14,14 0 1,1 ${cx},${cy - 14}`} fill="none" stroke="#0f5b5c" strokeWidth={1.6} />
                    <path d={arrowPath([cx - 4, cy - 15], [cx, cy - 14], 6)} fill="#0f5b5c" />
                    <path d={`M${cx - 4},${cy} h8 M${cx},${cy - 4} v8`} stroke="#0f5b5c" strokeWidth={1} />
                    <text x={cx + 16} y={cy + 14} fontSize={10} fill="#0f5b5c">
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
                  <line x1={a[0]} y1={a[1]} x2={z[0]} y2={z[1]} stroke="#0f5b5c" strokeWidth={1.4} strokeDasharray="10 3 2 3" />
                  <path
                    d={`M${mx + nx},${my + ny} Q${mx + Math.cos(ang) * 10},${my + Math.sin(ang) * 10} ${mx - nx},${my - ny}`}
                    fill="none"
                    stroke="#0f5b5c"
                    strokeWidth={1.4}
                  />
                  <path d={arrowPath([mx - nx + 2, my - ny + 2], [mx - nx, my - ny], 5)} fill="#0f5b5c" />
                  <text x={z[0] + 3} y={z[1] + 12} fontSize={10} fill="#0f5b5c">
                    {label}
                  </text>
                </g>
              );
            }),
          )}

        {/* scale bar */}
        <g transform={`translate(${14},${H - 14})`} fontSize={9} fill="#55595d">
          <line x1={0} y1={0} x2={bar * fit.scale} y2={0} stroke="#2b2d2f" strokeWidth={1.2} />
          <line x1={0} y1={-4} x2={0} y2={4} stroke="#2b2d2f" />
          <line x1={bar * fit.scale} y1={-4} x2={bar * fit.scale} y2={4} stroke="#2b2d2f" />
          <text x={bar * fit.scale + 5} y={3} data-testid="scale-bar">
            {Number(bar.toPrecision(3))} {lengthUnit}
          </text>
        </g>
      </svg>
    </div>
  );
}
