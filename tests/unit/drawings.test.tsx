/** The drawing component: the right number of contacts, normal arrows, motion axes, loops and forces for example layouts. */
import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { LayoutDrawings, flexureReadout } from "@/components/layout-views/layout-drawings";
import { convexHull, labelBox } from "@/components/layout-views/view-layers";
import { runEngine } from "@/lib/engine";
import { expandFlexures } from "@/lib/layout/flexures";
import { example } from "../support/examples";
import { generate, instrument } from "../support/instruments";

const count = (html: string, attr: string) => (html.match(new RegExp(`${attr}="`, "g")) ?? []).length;

function render(name: string, emphasis?: Parameters<typeof LayoutDrawings>[0]["emphasis"]) {
  const layout = example(name);
  const { report } = runEngine(layout);
  return { html: renderToStaticMarkup(<LayoutDrawings layout={layout} report={report} emphasis={emphasis} />), layout, report };
}

describe("LayoutDrawings", () => {
  it.each([
    "breadboard-four-feet",
    "breadboard-three-seats",
    "mirror-cell-three-vee",
    "instrument-plate-socket-vee-flat",
    "flexure-stage-one-freedom",
    "detector-sled-hidden-count",
    "flexure-stage-full-blades",
  ])("%s: four views, every contact and its normal in each", (name) => {
    const { html, layout } = render(name);
    expect(count(html, "data-view")).toBe(4);
    // flexure rows are drawn as contacts too, and each flexure as an element (analysis.md §10)
    const rows = expandFlexures(layout).contacts.length;
    expect(count(html, "data-contact")).toBe(4 * rows);
    expect(count(html, "data-normal")).toBe(4 * rows);
    expect(count(html, "data-flexure")).toBe(4 * (layout.flexures ?? []).length);
    expect(html).toContain('data-testid="scale-bar"');
    expect(html).toMatch(/\d+ mm<\/text>/);
  });

  it("four feet: three free motions (two translations and a rotation) drawn in each view, four loop contacts", () => {
    const { html } = render("breadboard-four-feet");
    expect(count(html, "data-motion")).toBe(3 * 4);
    // x and y translations in each view (seen end-on as a ringed dot where the view looks along them)
    expect((html.match(/data-kind="translation"/g) ?? []).length).toBe(2 * 4);
    expect((html.match(/data-kind="rotation"/g) ?? []).length).toBe(4);
    expect(count(html, "data-loop-contact")).toBe(4 * 4);
    expect(count(html, "data-force")).toBe(4 * 4);
  });

  it("three seats: no motion, no loop", () => {
    const { html } = render("breadboard-three-seats");
    expect(count(html, "data-motion")).toBe(0);
    expect(count(html, "data-loop-contact")).toBe(0);
  });

  it("a finding's emphasis fades the other contacts and draws only its motions", () => {
    const { html } = render("flexure-stage-full-blades", { contacts: ["blade-A.a", "blade-A.b", "blade-B.a", "blade-B.b"], motions: [] });
    expect((html.match(/data-emphasised="true"/g) ?? []).length).toBe(16);
    expect((html.match(/data-emphasised="false"/g) ?? []).length).toBe(8);
    expect(count(html, "data-motion")).toBe(0);
  });

  it("lifted-off seats are marked in a load case that lifts them (first case shown)", () => {
    const layout = example("instrument-plate-socket-vee-flat");
    layout.loadCases = [{ id: "inverted", gravity: [0, 0, 9.80665], loads: ["nest-spring"] }];
    const { report } = runEngine(layout);
    const html = renderToStaticMarkup(<LayoutDrawings layout={layout} report={report} />);
    expect(count(html, "data-lifted")).toBe(4 * report.seating!.liftOff.length);
    expect(report.seating!.liftOff.length).toBeGreaterThan(0);
  });

  it("draws moved contacts' earlier positions (revision diff) in every view", () => {
    const layout = example("breadboard-three-seats");
    const { report } = runEngine(layout);
    const ghosts = [
      { id: "S1a", point: [40, 40, -4.49] as [number, number, number] },
      { id: "S2b", point: [560, 40, -4.49] as [number, number, number] },
    ];
    const html = renderToStaticMarkup(<LayoutDrawings layout={layout} report={report} ghosts={ghosts} />);
    expect(count(html, "data-ghost")).toBe(2 * 4);
    expect(html).toContain("S1a (before)");
  });

  it("prints without controls", () => {
    const layout = example("breadboard-four-feet");
    const { report } = runEngine(layout);
    const html = renderToStaticMarkup(<LayoutDrawings layout={layout} report={report} print />);
    expect(count(html, "data-view")).toBe(4);
    expect(html).not.toContain("Zoom in");
    expect(html).not.toContain('type="checkbox"');
  });

  it("describes what is drawn in text for people who cannot see the drawing", () => {
    const { html } = render("breadboard-four-feet");
    expect(html).toContain("What is drawn");
    expect(html).toMatch(/3 free motions drawn as screw axes/);
    expect(html).toMatch(/1 over-constrained loop marked on contacts F1, F2, F3, F4/);
  });

  it("blades as thin rectangles, wires as lines, in every view", () => {
    const blades = render("flexure-stage-full-blades").html;
    expect((blades.match(/data-kind="blade"/g) ?? []).length).toBe(2 * 4);
    const wires = render("hexapod-wire-platform").html;
    expect((wires.match(/data-kind="wire"/g) ?? []).length).toBe(6 * 4);
  });

  it("marks each thermal centre and each point's drift direction; draws each point's 3σ ellipse with a legend", () => {
    const { html, report } = render("instrument-plate-socket-vee-flat");
    expect(report.thermal).not.toBeNull();
    expect(count(html, "data-thermal-centre")).toBe(4);
    expect(count(html, "data-point")).toBe(2 * 4);
    expect(count(html, "data-ellipse")).toBe(2 * 4);
    expect(html).toContain("thermal centre (TC)");
    expect(html).toMatch(/3σ repeatability ellipse/);
  });

  it("reads out a flexure row's kind, dimensions and stiffness", () => {
    const layout = example("flexure-stage-full-blades");
    const row = expandFlexures(layout).contacts.find((c) => c.id === "blade-A.s");
    // in-plane stiffness E·t·w³/ℓ³ = 200 GPa · 0.25 mm · (60 mm)³ / (40 mm)³ = 168 750 N/mm (§10, derived)
    expect(flexureReadout(layout, "blade-A.s", row, "mm", "N")).toBe(
      " · blade blade-A (row s): length 40 mm, width 60 mm, thickness 0.25 mm, blade-steel, stiffness 168750 N/mm",
    );
  });

  it("outlines each body in every view (convex hull of its contacts, points and centre of mass)", () => {
    const { html } = render("breadboard-three-seats");
    expect(count(html, "data-outline")).toBe(4);
    expect(html).toContain("body outline: the convex hull");
    // Andrew's monotone chain on a square with an inner point keeps the four corners [D]
    expect(
      convexHull([
        [0, 0],
        [2, 0],
        [2, 2],
        [0, 2],
        [1, 1],
      ]).length,
    ).toBe(4);
  });

  it("places labels so that no two label boxes overlap (breadboard, every view)", () => {
    const { html } = render("breadboard-three-seats");
    const boxes = [
      ...html.matchAll(/<text x="([-\d.e]+)" y="([-\d.e]+)" text-anchor="(start|end)" font-size="8.5"[^>]*data-label="([^"]+)"[^>]*>([^<]*)</g),
    ].map((m) => labelBox(Number(m[1]), Number(m[2]), m[5], 8.5, m[3] as "start" | "end"));
    expect(boxes.length).toBeGreaterThan(20);
    // boxes of one view never intersect (views are 4 separate SVGs: compare within each quarter of the list)
    const perView = boxes.length / 4;
    for (let v = 0; v < 4; v++) {
      const b = boxes.slice(v * perView, (v + 1) * perView);
      for (let i = 0; i < b.length; i++)
        for (let j = i + 1; j < b.length; j++) {
          const [p, q] = [b[i], b[j]];
          expect(p[0] < q[0] + q[2] && q[0] < p[0] + p[2] && p[1] < q[1] + q[3] && q[1] < p[1] + p[3]).toBe(false);
        }
    }
  });

  it("motion labels read differently from contact ids", () => {
    const { html } = render("breadboard-four-feet");
    expect(html).toMatch(/data-motion-label="">↻ R3/);
  });
});

describe("a crowded drawing (40 mounts on a bench, each with its thermal centre)", () => {
  const layout = instrument(generate(40, "star", 77, 7));
  const { report } = runEngine(layout);
  const tcLabels = (html: string) => [...html.matchAll(/>TC (b\d+)<\/text>/g)].map((m) => m[1]);

  it("draws every thermal centre but labels none of them when nothing is in focus", () => {
    const html = renderToStaticMarkup(<LayoutDrawings layout={layout} report={report} />);
    // the bench is of the base's steel: no thermal centre of its own (analysis.md §9)
    const centres = Object.values(report.thermal!.bodies).filter((b) => b.centre).length;
    expect(centres).toBe(39);
    expect((html.match(/data-thermal-centre="/g) ?? []).length).toBe(4 * centres);
    expect(tcLabels(html)).toEqual([]);
  });

  it("labels the centres of the bodies in focus and dims the rest", () => {
    const contacts = layout.contacts.filter((c) => c.body === "b7").map((c) => c.id);
    const html = renderToStaticMarkup(<LayoutDrawings layout={layout} report={report} emphasis={{ contacts }} />);
    // b7's seats join it to the bench b0, both in focus; the bench has no centre, so b7's is labelled in each view
    expect(tcLabels(html)).toEqual(["b7", "b7", "b7", "b7"]);
    expect((html.match(/data-thermal-centre="b12" opacity="0.25"/g) ?? []).length).toBe(4);
  });
});
