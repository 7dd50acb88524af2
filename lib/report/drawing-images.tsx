/**
 * The four drawing views of a revision as images for the PDF report: the same React component the layout page
 * shows (components/layout-views, print mode) is rendered to SVG markup with react-dom/server, and each view's SVG
 * is rasterised by resvg (@resvg/resvg-js, a maintained SVG renderer) with the Inter faces shipped in an npm package.
 * Runs in the analysis worker thread (lib/worker/analyse-worker.ts): the component is a client module, which a
 * Next.js route handler may not render, and rasterising a large layout should not hold the server's event loop.
 */
import { createRequire } from "node:module";
import path from "node:path";
import { renderToStaticMarkup } from "react-dom/server";
import { Resvg } from "@resvg/resvg-js";
import { LayoutDrawings } from "@/components/layout-views/layout-drawings";
import { palette } from "@/components/layout-views/palette";
import type { Layout } from "@/lib/layout/model";
import type { Report } from "@/lib/engine";

export interface DrawingImage {
  /** plan, front, side or axonometric */
  name: string;
  /** the view's title and projection as the screen shows them, e.g. "Plan · looking down −z" */
  title: string;
  /** PNG at `zoom` times the view's SVG size */
  png: Uint8Array;
  width: number;
  height: number;
}

export interface DrawingSheet {
  views: DrawingImage[];
  /** the legend lines under the views, as the screen words them */
  legend: string[];
}

/** Raster scale: the 420 × 300 view at 3× is 1260 × 900 px, about 250 dpi at the 12.7 cm the PDF gives it. */
const ZOOM = 3;

function fontFiles(): string[] {
  // resolved from this module so the worker bundle finds the package in node_modules at run time
  const req = createRequire(path.join(process.cwd(), "package.json"));
  const dir = path.dirname(req.resolve("@expo-google-fonts/inter/package.json"));
  return ["400Regular", "400Regular_Italic", "700Bold", "700Bold_Italic"].map((w) => path.join(dir, w, `Inter_${w}.ttf`));
}

const decode = (s: string) =>
  s
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&quot;/g, '"')
    .replace(/&#x27;/g, "'")
    .replace(/&amp;/g, "&");

/** Renders the print form of the drawings and rasterises each view. */
export function drawingImages(layout: Layout, report: Report): DrawingSheet {
  const html = renderToStaticMarkup(<LayoutDrawings layout={layout} report={report} print />);
  const files = fontFiles();
  const views: DrawingImage[] = [];
  // each view: a caption row (title, projection) followed by its <svg data-view=…>; view SVGs hold no nested <svg>
  const viewRe =
    /<span class="font-semibold">([^<]*)<\/span><span class="text-graphite-soft">([^<]*)<\/span>[\s\S]*?(<svg[^>]*data-view="(\w+)"[^>]*>[\s\S]*?<\/svg>)/g;
  for (const m of html.matchAll(viewRe)) {
    const [, title, projection, markup, name] = m;
    const viewBox = /viewBox="([^"]+)"/.exec(markup)![1];
    const [x, y, w, h] = viewBox.split(/\s+/).map(Number);
    // a standalone SVG: namespace, size, paper background and the drawing's face; classes mean nothing outside the page
    const svg = markup
      .replace(/^<svg/, `<svg xmlns="http://www.w3.org/2000/svg" font-family="Inter" color="${palette.ink}" height="${h}"`)
      .replace(/ width="100%"/, ` width="${w}"`)
      .replace(/ class="[^"]*"/g, "")
      .replace(/(<svg[^>]*>)/, `$1<rect x="${x}" y="${y}" width="${w}" height="${h}" fill="${palette.paper}"/>`);
    const image = new Resvg(svg, {
      fitTo: { mode: "zoom", value: ZOOM },
      font: { loadSystemFonts: false, fontFiles: files, defaultFontFamily: "Inter" },
    }).render();
    views.push({ name, title: `${decode(title)} · ${decode(projection)}`, png: new Uint8Array(image.asPng()), width: image.width, height: image.height });
  }
  const legendBlock = /data-testid="drawing-legend">([\s\S]*?)<\/div>/.exec(html)?.[1] ?? "";
  const legend = [...legendBlock.matchAll(/<span>([\s\S]*?)<\/span>/g)].map((s) =>
    decode(s[1].replace(/<svg[\s\S]*?<\/svg>/g, "").replace(/<[^>]+>/g, ""))
      .replace(/\s+/g, " ")
      .trim(),
  );
  return { views, legend };
}
