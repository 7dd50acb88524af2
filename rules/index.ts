/** The rule registry (alphabetical) and the runner that turns an analysis into findings. */
import contactOverstress from "./contact-overstress";
import countMismatch from "./count-mismatch";
import couplingGeometry from "./coupling-geometry";
import foundationCoupling from "./foundation-coupling";
import freeMotion from "./free-motion";
import functionalPointSensitivity from "./functional-point-sensitivity";
import loadDrivesFreedom from "./load-drives-freedom";
import lowSeatingMargin from "./low-seating-margin";
import missingData from "./missing-data";
import pointRepeatability from "./point-repeatability";
import redundantConstraint from "./redundant-constraint";
import seatLiftOff from "./seat-lift-off";
import thermalDrift from "./thermal-drift";
import thermalMismatch from "./thermal-mismatch";
import weakConstraint from "./weak-constraint";
import { CAUTION, needsCaution } from "@/lib/caution";
import { fingerprintOf, type Finding, type Rule, type Severity } from "./types";
import type { EngineAnalysis } from "@/lib/analysis";

// each rule has its own options type; the registry holds them side by side
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- justified: heterogeneous option types
export const rules: Rule<any>[] = [
  contactOverstress,
  countMismatch,
  couplingGeometry,
  foundationCoupling,
  freeMotion,
  functionalPointSensitivity,
  loadDrivesFreedom,
  lowSeatingMargin,
  missingData,
  pointRepeatability,
  redundantConstraint,
  seatLiftOff,
  thermalDrift,
  thermalMismatch,
  weakConstraint,
];

export interface RuleOverride {
  severity?: Severity;
  options?: Record<string, unknown>;
}

const order: Record<Severity, number> = { error: 0, warning: 1, info: 2 };

/** Runs every rule (with project overrides) and returns findings, errors first. */
export function runRules(analysis: EngineAnalysis, overrides: Record<string, RuleOverride> = {}): Finding[] {
  const findings: Finding[] = [];
  const caution = needsCaution(analysis.layout);
  for (const rule of rules) {
    const o = overrides[rule.meta.id] ?? {};
    const options = rule.meta.options.parse(o.options ?? {});
    for (const d of rule.check({ layout: analysis.layout, analysis, options })) {
      const severity = o.severity ?? d.severity ?? rule.meta.severity;
      findings.push({
        rule: rule.meta.id,
        severity,
        title: d.title,
        fingerprint: fingerprintOf(rule.meta.id, d),
        contacts: d.contacts ?? [],
        features: d.features ?? [],
        bodies: d.bodies ?? [],
        ...(d.loadCase ? { loadCase: d.loadCase } : {}),
        body: caution && severity === "error" ? `${d.body}\n\n${CAUTION}` : d.body,
      });
    }
  }
  return findings.sort((a, b) => order[a.severity] - order[b.severity]);
}
