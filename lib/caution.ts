/** The product's caution for mounts that can hurt someone: one text, one threshold (product brief, "Cautions"). */
import type { Layout } from "@/lib/layout/model";

/** Standard caution for mounts that can hurt someone. */
export const CAUTION =
  "> **Caution.** This result is a design aid for rigid-body constraint and Hertz contact. It does not replace a structural analysis; for heavy or fragile parts, payloads over people and preloaded springs, local codes, company standards and licensed engineering practice decide.";

/** Whether a layout holds enough mass or preload to hurt someone (common practice threshold: 10 kg or any preload). */
export function needsCaution(layout: Layout): boolean {
  const mass = layout.bodies.reduce((s, b) => s + (b.mass ?? 0), 0);
  return mass >= 10 || layout.loads.length > 0;
}
