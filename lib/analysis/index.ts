/** The engine's analysis of a validated layout (pure, no I/O). */
import type { Layout } from "@/lib/layout/model";
import { analyseConstraint, type ConstraintAnalysis } from "./constraint";

export type { ConstraintAnalysis, Motion, Screw, SelfStressState } from "./constraint";

export interface EngineAnalysis {
  layout: Layout;
  constraint: ConstraintAnalysis;
}

/** Analyses a layout: rank, freedoms, redundancies, screws, self-stress, conditioning. */
export function analyseLayout(layout: Layout): EngineAnalysis {
  return { layout, constraint: analyseConstraint(layout) };
}
