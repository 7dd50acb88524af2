/**
 * The PDF report carries the four drawing views of the screen: the print form of the drawing component rendered
 * to SVG, rasterised by resvg and placed in the PDF. Read back with pdf.js (via unpdf) for the text, and with
 * pdf-lib's parser and Node's zlib for the image streams: the captions and legend, the four images at their size,
 * and ink where the SVG put each contact.
 */
import { inflateSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { renderToStaticMarkup } from "react-dom/server";
import { PDFDict, PDFDocument, PDFName, PDFRawStream } from "pdf-lib";
import { extractText, getDocumentProxy } from "unpdf";
import { LayoutDrawings } from "@/components/layout-views/layout-drawings";
import { views } from "@/components/layout-views/projection";
import { runEngine } from "@/lib/engine";
import { drawingImages } from "@/lib/report/drawing-images";
import { reportPdf, winAnsi } from "@/lib/report/pdf";
import { example } from "../support/examples";

const markdown = "# Layout review\n\nSummary line.\n\n## Summary\n\nTwo findings.\n\n## Findings\n\n### First finding\n\nText.";

describe("drawing images for the PDF report", () => {
  const layout = example("breadboard-three-seats");
  const { report } = runEngine(layout);
  const sheet = drawingImages(layout, report);

  it("renders the four screen views, captioned as on screen, at three times the view size", () => {
    expect(sheet.views.map((v) => v.name)).toEqual(views.map((v) => v.name));
    sheet.views.forEach((v, i) => {
      expect(v.title).toBe(`${views[i].title} · ${views[i].projection}`);
      expect([v.width, v.height]).toEqual([1260, 900]);
      expect([...v.png.slice(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    });
    expect(sheet.legend.some((l) => /^body outline: the convex hull/.test(l))).toBe(true);
    expect(sheet.legend.some((l) => /seated force/.test(l))).toBe(true);
  });

  it("places the views and legend before the findings; each contact of the plan has ink at its SVG position", async () => {
    const bytes = await reportPdf(markdown, sheet);
    const pdf = await getDocumentProxy(bytes.slice());
    const { text } = await extractText(pdf, { mergePages: true });
    const flat = text.replace(/\s+/g, " ");
    expect(flat.indexOf("Drawing views")).toBeGreaterThan(-1);
    expect(flat.indexOf("Drawing views")).toBeLessThan(flat.indexOf("Findings"));
    for (const v of sheet.views) expect(flat).toContain(winAnsi(v.title));
    expect(flat).toContain("body outline: the convex hull");
    // the image streams in drawing order (plan first): pdf-lib stores a PNG as FlateDecode RGB rows
    const doc = await PDFDocument.load(bytes);
    const images = doc.getPages().flatMap((page) => {
      const xo = page.node.Resources()?.lookup(PDFName.of("XObject"), PDFDict);
      return (xo?.entries() ?? []).map(([, ref]) => {
        const s = doc.context.lookup(ref) as PDFRawStream;
        const num = (k: string) => Number(String(s.dict.get(PDFName.of(k))));
        return { width: num("Width"), height: num("Height"), channels: 3, data: inflateSync(s.contents) };
      });
    });
    expect(images).toHaveLength(4);
    for (const im of images) expect([im.width, im.height, im.data.length]).toEqual([1260, 900, 1260 * 900 * 3]);
    // the plan: where the SVG draws each contact marker (a dark ring of radius r), the raster has dark pixels
    const html = renderToStaticMarkup(<LayoutDrawings layout={layout} report={report} print />);
    const plan = /<svg[^>]*data-view="plan"[\s\S]*?<\/svg>/.exec(html)![0];
    const [vx, vy] = /viewBox="([^"]+)"/.exec(plan)![1].split(" ").map(Number);
    const im = images[0];
    const dark = (x: number, y: number) => {
      const i = (Math.round(y) * im.width + Math.round(x)) * im.channels;
      return im.data[i] + im.data[i + 1] + im.data[i + 2] < 3 * 110;
    };
    for (const c of layout.contacts) {
      const m = new RegExp(`data-contact="${c.id}"[\\s\\S]*?<circle cx="([-\\d.e]+)" cy="([-\\d.e]+)" r="([\\d.]+)"`).exec(plan)!;
      const [cx, cy, r] = [Number(m[1]) - vx, Number(m[2]) - vy, Number(m[3])];
      let found = 0;
      for (let a = 0; a < 360; a += 10) {
        const t = (a * Math.PI) / 180;
        if (dark(3 * (cx + r * Math.cos(t)), 3 * (cy + r * Math.sin(t)))) found++;
      }
      expect(found, c.id).toBeGreaterThan(18);
    }
    // and the paper colour elsewhere: most of the image is light
    let light = 0;
    for (let i = 0; i < im.width * im.height; i += 97) if (im.data[i * im.channels] > 230) light++;
    expect(light / Math.ceil((im.width * im.height) / 97)).toBeGreaterThan(0.8);
  });
});
