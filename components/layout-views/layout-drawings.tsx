"use client";
/**
 * The four drawing views of a layout (plan, front, side, axonometric) with its findings drawn on them:
 * contacts with normal arrows, free motions as screw axes, over-constrained loops, seated forces,
 * lift-offs and, on demand, the foundation-coupling response. Shapes and line styles carry the meaning,
 * so the drawing holds in black and white and for colour-blind readers.
 */
import { useMemo, useState } from "react";
import type { Layout, Vec3 } from "@/lib/layout/model";
import type { Report } from "@/lib/engine";
import { expandFlexures, flexureLength } from "@/lib/layout/flexures";
import { fitPoints, project, scaleBarLength, toSvg, views, type Fit } from "./projection";
import { FlexureLayer, PointLayer, ThermalLayer, largestThreeSigmaUm } from "./service-layers";
import { palette } from "./palette";
import {
  BODY_SHAPES,
  ContactLayer,
  FeatureLayer,
  ForceLayer,
  GhostLayer,
  LoopLayer,
  MotionLayer,
  OutlineLayer,
  ScaleBar,
  labelItems,
  placeLabels,
  type ViewContext,
} from "./view-layers";
import { usePanZoom } from "./use-pan-zoom";
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
  /** the body in focus when the page shares its body filter with the drawings (controlled); own state otherwise */
  focusBody?: string;
  onFocusBody?: (body: string) => void;
}

const W = 420;
const H = 300;
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

export function LayoutDrawings({ layout: file, report, emphasis, print = false, ghosts = [], focusBody: sharedFocus, onFocusBody }: Props) {
  // flexure elements are drawn as elements and their generated rows as contacts (analysis.md §10)
  const layout = useMemo(() => expandFlexures(file), [file]);
  const [showMotions, setShowMotions] = useState(true);
  const [showLoops, setShowLoops] = useState(true);
  const [showForces, setShowForces] = useState(!!report.seating?.forces);
  const [showFoundation, setShowFoundation] = useState(false);
  const [active, setActive] = useState<string | null>(null);
  // focus one body: its contacts stand out and every view is fitted to it
  const [ownFocus, setOwnFocus] = useState("");
  const focusBody = onFocusBody ? (sharedFocus ?? "") : ownFocus;
  const setFocusBody = onFocusBody ?? setOwnFocus;
  const shownEmphasis: Emphasis | undefined = focusBody
    ? { contacts: layout.contacts.filter((c) => c.body === focusBody || c.on === focusBody).map((c) => c.id), motions: emphasis?.motions }
    : emphasis;
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
          {/* a page with its own body filter (shared with its tables) sets the focus from there */}
          {layout.bodies.length > 1 && !onFocusBody && (
            <label className="flex items-center gap-1">
              focus on
              <select className="field w-auto py-0.5 text-xs" value={focusBody} onChange={(e) => setFocusBody(e.target.value)} aria-label="Focus on a body">
                <option value="">all bodies</option>
                {layout.bodies.map((b) => (
                  <option key={b.id} value={b.id}>
                    {b.id}
                  </option>
                ))}
              </select>
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
            emphasis={shownEmphasis}
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
          !print && <span className="text-graphite-soft">Point at or tab to a contact to read its coordinates, normal and seated force.</span>
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
        <svg width="30" height="12" aria-hidden="true">
          <polygon points="2,10 8,2 28,4 26,10" fill={palette.outlineFill} stroke={palette.outline} strokeWidth="0.8" />
        </svg>{" "}
        body outline: the convex hull of what the file says about the body (its contacts, points and centre of mass), not its true shape
      </span>
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
          <line x1="2" y1="5" x2="28" y2="5" stroke={palette.accent} strokeWidth="2.2" />
          <path d="M28 5 l-5 -3 v6 z" fill={palette.accent} />
        </svg>{" "}
        free translation
      </span>
      <span>
        <svg width="30" height="10" aria-hidden="true">
          <line x1="2" y1="5" x2="28" y2="5" stroke={palette.accent} strokeWidth="1.4" strokeDasharray="8 3 2 3" />
        </svg>{" "}
        rotation or screw axis (turning arrow; pitch noted)
      </span>
      <span>
        <svg width="30" height="10" aria-hidden="true">
          <circle cx="15" cy="5" r="4" fill="none" stroke={palette.conflict} strokeWidth="1.6" strokeDasharray="2 1.5" />
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

interface OneViewProps extends Omit<ViewContext, "px" | "arrow" | "extent" | "scale" | "bar" | "emph" | "towardViewer" | "frame" | "labels"> {
  /** the layout as in the file (flexure elements, points) */
  file: Layout;
}

function OneView(props: OneViewProps) {
  const { view, layout, file, report, emphasis, print, ghosts } = props;
  const zoom = usePanZoom(W, H, print);
  // the frame follows the revision shown (contacts, flexure ends, points, thermal centres, earlier positions);
  // a finding or a focused body is fitted to its own contacts
  const focusKey = emphasis && emphasis.contacts.length ? emphasis.contacts.join("\u0000") : "";
  const fit: Fit = useMemo(() => {
    const focus = focusKey ? new Set(focusKey.split("\u0000")) : null;
    if (focus) {
      const pts = layout.contacts.filter((c) => focus.has(c.id)).map((c) => project(c.point, view));
      if (pts.length) {
        // fitted to the focused contacts, but never to less than a quarter of the layout, so they keep their surroundings
        const all = layout.contacts.map((c) => project(c.point, view));
        const span = Math.max(...[0, 1].map((k) => Math.max(...all.map((p) => p[k])) - Math.min(...all.map((p) => p[k]))), 1e-9);
        const cx = pts.reduce((s, p) => s + p[0], 0) / pts.length;
        const cy = pts.reduce((s, p) => s + p[1], 0) / pts.length;
        const half = span / 8;
        return fitPoints([...pts, [cx - half, cy - half], [cx + half, cy + half]], W, H, 40);
      }
    }
    const model: Vec3[] = [
      ...layout.contacts.map((c) => c.point),
      ...(file.flexures ?? []).flatMap((f) => (f.kind === "wire" ? [f.from, f.to] : [f.root, f.tip])),
      ...file.points.map((p) => p.point),
      ...Object.values(report.thermal?.bodies ?? {}).flatMap((b) => (b.centre ? [b.centre] : [])),
      ...ghosts.map((g) => g.point),
    ];
    const pts = model.map((p) => project(p, view));
    return fitPoints(pts.length ? pts : [[0, 0]], W, H, 40);
  }, [layout, file, report, ghosts, view, focusKey]);
  const extent = Math.max((W - 80) / fit.scale, 1e-9);
  const [r, u] = [view.right, view.up];
  const v: ViewContext = {
    ...props,
    px: (p) => toSvg(fit, p),
    arrow: extent * 0.09,
    extent,
    scale: fit.scale,
    bar: scaleBarLength(fit),
    emph: (id) => !emphasis || emphasis.contacts.includes(id),
    towardViewer: [r[1] * u[2] - r[2] * u[1], r[2] * u[0] - r[0] * u[2], r[0] * u[1] - r[1] * u[0]],
    frame: zoom.frame,
    labels: new Map(),
  };
  v.labels = placeLabels(labelItems(layout, view, v.px, v.emph));
  // bodies in focus: those the emphasised contacts join, or every body when nothing is emphasised; the empty id
  // counts as in focus only then, which tells the marks whether a focus narrows their labels on a crowded drawing
  const focusKeyBodies = useMemo(() => {
    if (!focusKey) return null;
    const ids = new Set(focusKey.split("\u0000"));
    return new Set(layout.contacts.filter((c) => ids.has(c.id)).flatMap((c) => [c.body, c.on]));
  }, [layout, focusKey]);
  const bodyEmph = (id: string) => !focusKeyBodies || (id !== "" && focusKeyBodies.has(id));

  return (
    <div className="relative">
      <div className="mb-1 flex items-baseline gap-2 text-xs">
        <span className="font-semibold">{view.title}</span>
        <span className="text-graphite-soft">{view.projection}</span>
        {!print && (
          <span className="no-print ml-auto flex gap-1">
            <button type="button" className="btn-quiet px-1.5 py-0" aria-label={`Zoom in ${view.title}`} onClick={zoom.zoomIn}>
              +
            </button>
            <button type="button" className="btn-quiet px-1.5 py-0" aria-label={`Zoom out ${view.title}`} onClick={zoom.zoomOut}>
              −
            </button>
            <button type="button" className="btn-quiet px-1.5 py-0" aria-label={`Fit ${view.title}`} onClick={zoom.reset}>
              fit
            </button>
          </span>
        )}
      </div>
      <svg
        viewBox={zoom.viewBox}
        width="100%"
        role="img"
        aria-label={`${view.title} view (${view.projection}) of ${layout.contacts.length} contacts`}
        className="h-auto w-full touch-none select-none rounded-sm border border-paper-line bg-[#fdfbf6]"
        data-view={view.name}
        ref={zoom.svgRef}
        {...zoom.handlers}
      >
        <OutlineLayer v={v} file={file} />
        <FeatureLayer v={v} />
        <LoopLayer v={v} />
        <GhostLayer v={v} />
        <FlexureLayer layout={file} view={view} px={v.px} emph={v.emph} />
        <ForceLayer v={v} />
        <ContactLayer v={v} />
        <PointLayer layout={file} report={report} view={view} px={v.px} emph={v.emph} refPx={v.arrow * fit.scale} bodyEmph={bodyEmph} />
        <ThermalLayer layout={file} report={report} view={view} px={v.px} emph={v.emph} arrow={v.arrow} bodyEmph={bodyEmph} />
        <MotionLayer v={v} />
        <ScaleBar v={v} />
      </svg>
    </div>
  );
}
