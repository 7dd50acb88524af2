/**
 * The release report as PDF, written with pdf-lib (pure JavaScript; no browser). The markdown report is
 * laid out as text (headings, paragraphs, table rows) with the plan view of the contacts drawn on the
 * first page. The standard PDF fonts cover WinAnsi only, so other characters are spelled out.
 */
import { PDFDocument, StandardFonts, degrees, rgb, type PDFFont, type PDFPage } from "pdf-lib";
import type { Layout } from "@/lib/layout/model";
import type { Report } from "@/lib/engine";
import { expandFlexures } from "@/lib/layout/flexures";

const replacements: [RegExp, string][] = [
  [/σ/g, "sigma"],
  [/−/g, "-"],
  [/–|—/g, "-"],
  [/→/g, "->"],
  [/≈/g, "~"],
  [/■/g, "[E]"],
  [/▲/g, "[W]"],
  [/●/g, "[I]"],
  [/◆/g, "*"],
  [/◇/g, "o"],
  [/○/g, "o"],
  [/✓/g, "v"],
  [/…/g, "..."],
  [/×/g, "x"],
  [/·/g, "."],
  [/‘|’/g, "'"],
  [/“|”/g, '"'],
  [/ü/g, "ue"],
  [/λ/g, "lambda"],
  [/δ/g, "delta"],
  [/ω/g, "omega"],
  [/√/g, "sqrt"],
  [/²/g, "^2"],
  [/³/g, "^3"],
  [/⁺/g, "+"],
  [/ᵀ/g, "T"],
  [/Ŵ|t̂/g, "w"],
];

/** Makes text safe for the standard PDF fonts (WinAnsi). */
export function winAnsi(text: string): string {
  let t = text;
  for (const [re, to] of replacements) t = t.replace(re, to);
  // keep printable Latin-1 (µ, °, ± are in WinAnsi); drop the rest
  return t.replace(/[^\x20-\x7e\xa0-\xff]/g, "?");
}

function wrap(text: string, font: PDFFont, size: number, width: number): string[] {
  const words = text.split(/\s+/);
  const lines: string[] = [];
  let line = "";
  for (const w of words) {
    const next = line ? `${line} ${w}` : w;
    if (font.widthOfTextAtSize(next, size) > width && line) {
      lines.push(line);
      line = w;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

/** Builds the PDF bytes of a report from its markdown and (optionally) the layout for the plan drawing. */
export async function reportPdf(markdown: string, drawing?: { layout: Layout; report: Report }): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(winAnsi(markdown.split("\n")[0].replace(/^#\s*/, "")));
  doc.setProducer("Sixfold");
  const regular = await doc.embedFont(StandardFonts.Helvetica);
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  const mono = await doc.embedFont(StandardFonts.Courier);
  const [W, H] = [595.28, 841.89];
  const margin = 50;
  let page: PDFPage = doc.addPage([W, H]);
  let y = H - margin;
  const ensure = (h: number) => {
    if (y - h < margin) {
      page = doc.addPage([W, H]);
      y = H - margin;
    }
  };
  const write = (text: string, font: PDFFont, size: number, indent = 0, gap = 2) => {
    for (const l of wrap(winAnsi(text), font, size, W - 2 * margin - indent)) {
      ensure(size + gap);
      page.drawText(l, { x: margin + indent, y: y - size, size, font, color: rgb(0.17, 0.18, 0.19) });
      y -= size + gap;
    }
  };
  let drew = false;
  for (const raw of markdown.split("\n")) {
    const line = raw.replace(/\*\*/g, "").replace(/`/g, "");
    if (/^# /.test(line)) write(line.slice(2), bold, 16, 0, 6);
    else if (/^## /.test(line)) {
      if (!drew && drawing && /^## Findings/.test(line)) {
        drew = true;
        drawPlan(
          page,
          drawing,
          margin,
          y,
          regular,
          (h) => {
            ensure(h);
            return y;
          },
          (dy) => (y -= dy),
        );
      }
      y -= 6;
      write(line.slice(3), bold, 12.5, 0, 4);
    } else if (/^### /.test(line)) {
      y -= 3;
      write(line.slice(4), bold, 10.5, 0, 3);
    } else if (/^\|/.test(line)) {
      if (/^\|[-| ]+\|$/.test(line)) continue;
      write(
        line
          .split("|")
          .slice(1, -1)
          .map((c) => c.trim())
          .join("   "),
        mono,
        8.5,
        8,
        2,
      );
    } else if (/^> /.test(line)) write(line.slice(2), regular, 8.5, 8, 2);
    else if (/^- /.test(line)) write(`- ${line.slice(2)}`, regular, 9.5, 6, 2);
    else if (line.trim() === "") y -= 4;
    else write(line, regular, 9.5, 0, 2);
  }
  // a report of a revision that was not approved carries a watermark on every page
  if (/^# DRAFT/.test(markdown)) {
    for (const p of doc.getPages()) {
      p.drawText("DRAFT - NOT APPROVED", { x: 110, y: 250, size: 46, font: bold, color: rgb(0.64, 0.15, 0.12), opacity: 0.16, rotate: degrees(40) });
    }
  }
  return doc.save();
}

function drawPlan(
  page: PDFPage,
  { layout }: { layout: Layout; report: Report },
  margin: number,
  _y: number,
  font: PDFFont,
  ensure: (h: number) => number,
  advance: (dy: number) => void,
) {
  const h = 220;
  const top = ensure(h + 20);
  const w = 595.28 - 2 * margin;
  const pts = expandFlexures(layout).contacts.map((c) => [c.point[0], c.point[1]] as const);
  if (!pts.length) return;
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const span = Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys), 1e-9);
  const s = Math.min((w - 40) / Math.max(Math.max(...xs) - Math.min(...xs), span * 0.05), (h - 40) / Math.max(Math.max(...ys) - Math.min(...ys), span * 0.05));
  const cx = (Math.max(...xs) + Math.min(...xs)) / 2;
  const cy = (Math.max(...ys) + Math.min(...ys)) / 2;
  const X = (x: number) => margin + w / 2 + (x - cx) * s;
  const Y = (yy: number) => top - h / 2 + (yy - cy) * s;
  page.drawRectangle({ x: margin, y: top - h, width: w, height: h, borderColor: rgb(0.6, 0.6, 0.6), borderWidth: 0.5 });
  page.drawText("Plan view (looking down -z; x right, y up)", { x: margin + 4, y: top - 10, size: 7.5, font });
  const arrow = span * 0.08 * s;
  for (const c of expandFlexures(layout).contacts) {
    const x = X(c.point[0]);
    const yy = Y(c.point[1]);
    const n = c.normal.map((v) => v / Math.hypot(...c.normal));
    page.drawCircle({ x, y: yy, size: 2.2, borderColor: rgb(0.1, 0.1, 0.1), borderWidth: 0.8 });
    if (Math.hypot(n[0], n[1]) > 0.05) page.drawLine({ start: { x, y: yy }, end: { x: x + n[0] * arrow, y: yy + n[1] * arrow }, thickness: 0.7 });
    page.drawText(winAnsi(c.id), { x: x + 3, y: yy + 3, size: 6, font });
  }
  advance(h + 14);
}
