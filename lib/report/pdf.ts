/**
 * The release report as PDF, written with pdf-lib (pure JavaScript; no browser). The markdown report is
 * laid out as text (headings, paragraphs, table rows); the four drawing views of the layout page, rendered
 * from the same SVG by resvg in a worker thread (lib/report/drawing-images.tsx), are placed before the
 * findings with the drawing legend. The standard PDF fonts cover WinAnsi only, so other characters are spelled out.
 */
import { PDFDocument, StandardFonts, degrees, rgb, type PDFFont, type PDFImage, type PDFPage } from "pdf-lib";
import type { DrawingSheet } from "@/lib/report/drawing-images";

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
  [/∝/g, "proportional to"],
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

const [PAGE_W, PAGE_H] = [595.28, 841.89];
const MARGIN = 50;
const INK = rgb(0.17, 0.18, 0.19);

/** The writing position: the current page and the height left on it; new pages as text runs over. */
class Cursor {
  page: PDFPage;
  y = PAGE_H - MARGIN;
  constructor(private doc: PDFDocument) {
    this.page = doc.addPage([PAGE_W, PAGE_H]);
  }
  /** starts a new page unless `h` points fit above the bottom margin */
  ensure(h: number) {
    if (this.y - h < MARGIN) {
      this.page = this.doc.addPage([PAGE_W, PAGE_H]);
      this.y = PAGE_H - MARGIN;
    }
  }
  write(text: string, font: PDFFont, size: number, indent = 0, gap = 2) {
    for (const l of wrap(winAnsi(text), font, size, PAGE_W - 2 * MARGIN - indent)) {
      this.ensure(size + gap);
      this.page.drawText(l, { x: MARGIN + indent, y: this.y - size, size, font, color: INK });
      this.y -= size + gap;
    }
  }
}

/** Builds the PDF bytes of a report from its markdown and (optionally) the drawing views of its layout. */
export async function reportPdf(markdown: string, drawings?: DrawingSheet): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(winAnsi(markdown.split("\n")[0].replace(/^#\s*/, "")));
  doc.setProducer("Sixfold");
  const regular = await doc.embedFont(StandardFonts.Helvetica);
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  const mono = await doc.embedFont(StandardFonts.Courier);
  const images = drawings ? await Promise.all(drawings.views.map((v) => doc.embedPng(v.png))) : [];
  const at = new Cursor(doc);
  let drew = false;
  for (const raw of markdown.split("\n")) {
    const line = raw.replace(/\*\*/g, "").replace(/`/g, "");
    if (/^# /.test(line)) at.write(line.slice(2), bold, 16, 0, 6);
    else if (/^## /.test(line)) {
      // the drawings go before the findings (or at the end of a report without them)
      if (!drew && drawings && /^## Findings/.test(line)) {
        drew = true;
        drawViews(drawings, images, { regular, bold }, at);
      }
      at.y -= 6;
      at.write(line.slice(3), bold, 12.5, 0, 4);
    } else if (/^### /.test(line)) {
      at.y -= 3;
      at.write(line.slice(4), bold, 10.5, 0, 3);
    } else if (/^\|/.test(line)) {
      if (/^\|[-| ]+\|$/.test(line)) continue;
      at.write(
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
    } else if (/^> /.test(line)) at.write(line.slice(2), regular, 8.5, 8, 2);
    else if (/^- /.test(line)) at.write(`- ${line.slice(2)}`, regular, 9.5, 6, 2);
    else if (line.trim() === "") at.y -= 4;
    else at.write(line, regular, 9.5, 0, 2);
  }
  if (!drew && drawings) drawViews(drawings, images, { regular, bold }, at);
  // a report of a revision that was not approved carries a watermark on every page
  if (/^# DRAFT/.test(markdown)) {
    for (const p of doc.getPages()) {
      p.drawText("DRAFT - NOT APPROVED", { x: 110, y: 250, size: 46, font: bold, color: rgb(0.64, 0.15, 0.12), opacity: 0.16, rotate: degrees(40) });
    }
  }
  return doc.save();
}

/** The four drawing views in a 2 × 2 grid, each captioned as on screen and framed, then the legend as text. */
function drawViews(sheet: DrawingSheet, images: PDFImage[], fonts: { regular: PDFFont; bold: PDFFont }, at: Cursor) {
  const gap = 12;
  const cellW = (PAGE_W - 2 * MARGIN - gap) / 2;
  at.y -= 6;
  at.ensure(40 + (cellW * 300) / 420);
  at.write("Drawing views", fonts.bold, 12.5, 0, 4);
  for (let i = 0; i < sheet.views.length; i += 2) {
    const row = sheet.views.slice(i, i + 2);
    const cellH = Math.max(...row.map((v) => (cellW * v.height) / v.width));
    at.ensure(cellH + 14);
    row.forEach((v, k) => {
      const x = MARGIN + k * (cellW + gap);
      const h = (cellW * v.height) / v.width;
      at.page.drawText(winAnsi(v.title), { x, y: at.y - 8, size: 7.5, font: fonts.bold, color: INK });
      at.page.drawImage(images[i + k], { x, y: at.y - 12 - h, width: cellW, height: h });
      at.page.drawRectangle({ x, y: at.y - 12 - h, width: cellW, height: h, borderColor: rgb(0.85, 0.83, 0.78), borderWidth: 0.5 });
    });
    at.y -= cellH + 18;
  }
  for (const l of sheet.legend) at.write(`- ${l}`, fonts.regular, 8, 6, 1.5);
  at.y -= 6;
}
