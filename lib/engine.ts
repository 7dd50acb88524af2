/** The whole check of one layout: analysis + rules → the machine-readable report of analysis.md §8. */
import type { Layout, Vec3 } from "@/lib/layout/model";
import {
  analyseLayout,
  type CouplingResult,
  type EngineAnalysis,
  type FlexureEntry,
  type HertzEntry,
  type Motion,
  type PointMotion,
  type PointRepeatability,
  type SeatingResult,
} from "@/lib/analysis";
import { runRules, type RuleOverride } from "@/rules";
import type { Finding } from "@/rules/types";

export interface ReportMotion {
  twist: Motion["twist"];
  screws: Motion["screws"];
}

export type SeatingReport = SeatingResult;

export interface Report {
  layout: string;
  units: Layout["units"];
  scaling: { centroid: Vec3; length: number };
  counts: { bodies: number; contacts: number; rank: number; freedoms: number; redundancies: number; grubler: number };
  conditioning: number;
  weakestDirection: ReportMotion | null;
  freeMotions: ReportMotion[];
  selfStressDimension: number;
  selfStress: { pivot: string; forces: Record<string, number> }[];
  seating: SeatingReport | null;
  hertz: Record<string, HertzEntry>;
  foundation: {
    sensitivity: Record<string, Record<string, number>>;
    maxPerMicrometre: number;
    warp: { pivot: string; forces: Record<string, number> }[];
    stiffness: string;
  } | null;
  loadCases: { id: string; gravity: Vec3; seating: SeatingReport | null; hertz: Record<string, HertzEntry>; unloaded: string[] }[];
  points: Record<string, PointMotion>;
  couplings: CouplingResult[];
  flexures: FlexureEntry[];
  thermal: {
    swingK: number | null;
    undetermined: boolean;
    bodies: Record<string, { centre: Vec3 | null }>;
    forcesPerK: Record<string, number> | null;
    points: Record<string, { driftUmPerK: Vec3 }>;
  } | null;
  repeatability: { undetermined: boolean; points: Record<string, PointRepeatability> } | null;
  findings: Finding[];
}

const motion = (m: Motion): ReportMotion => ({ twist: m.twist, screws: m.screws });

/** Builds the report from an analysis and its findings. */
export function buildReport(analysis: EngineAnalysis, findings: Finding[]): Report {
  const c = analysis.constraint;
  const st = analysis.statics;
  return {
    layout: analysis.layout.name,
    units: analysis.layout.units,
    scaling: { centroid: c.centroid, length: c.length },
    counts: c.counts,
    conditioning: c.conditioning,
    weakestDirection: c.weakestDirection ? motion(c.weakestDirection) : null,
    freeMotions: c.freeMotions.map(motion),
    selfStressDimension: c.selfStressDimension,
    selfStress: c.selfStress,
    seating: st.cases[0]?.seating ?? null,
    hertz: st.cases[0]?.hertz ?? {},
    foundation: st.foundation,
    loadCases: st.cases.map((k) => ({ id: k.id, gravity: k.gravity, seating: k.seating, hertz: k.hertz, unloaded: k.unloaded })),
    points: st.points,
    couplings: analysis.couplings,
    flexures: analysis.flexures,
    thermal: analysis.thermal
      ? {
          swingK: analysis.thermal.swingK,
          undetermined: analysis.thermal.undetermined,
          bodies: analysis.thermal.bodies,
          forcesPerK: analysis.thermal.forcesPerK,
          points: analysis.thermal.points,
        }
      : null,
    repeatability: analysis.repeatability,
    findings,
  };
}

/** Analyses a validated layout, runs the rules and returns analysis and report. */
export function runEngine(layout: Layout, overrides: Record<string, RuleOverride> = {}): { analysis: EngineAnalysis; report: Report } {
  const analysis = analyseLayout(layout);
  const findings = runRules(analysis, overrides);
  return { analysis, report: buildReport(analysis, findings) };
}
