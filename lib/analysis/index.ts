/** The engine's analysis of a validated layout (pure, no I/O). */
import type { Layout } from "@/lib/layout/model";
import { analyseConstraint, type ConstraintAnalysis } from "./constraint";
import { analyseStatics, type StaticsResult } from "./statics";
import { analyseCouplings, type CouplingResult } from "./coupling";

export type { ConstraintAnalysis, Motion, Screw, SelfStressState } from "./constraint";
export type { StaticsResult, CaseResult, HertzEntry, SeatingResult, FoundationResult, PointMotion, StiffnessSource } from "./statics";
export type { CouplingResult } from "./coupling";

export interface EngineAnalysis {
  layout: Layout;
  constraint: ConstraintAnalysis;
  statics: StaticsResult;
  couplings: CouplingResult[];
}

/** Analyses a layout: rank, screws, self-stress, seating per load case, foundation coupling, Hertz, couplings. */
export function analyseLayout(layout: Layout): EngineAnalysis {
  const constraint = analyseConstraint(layout);
  return { layout, constraint, statics: analyseStatics(layout, constraint), couplings: analyseCouplings(layout) };
}
