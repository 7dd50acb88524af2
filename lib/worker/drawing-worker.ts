/** Worker thread (pooled by piscina, see run-analysis.ts): renders a revision's four drawing views to PNG for the PDF report. */
import { drawingImages, type DrawingSheet } from "@/lib/report/drawing-images";
import type { Layout } from "@/lib/layout/model";
import type { Report } from "@/lib/engine";

export default function draw(req: { layout: Layout; report: Report }): DrawingSheet {
  return drawingImages(req.layout, req.report);
}
