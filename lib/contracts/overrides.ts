/** Contracts of overrides: the shapes route handlers answer with and components read, and the input schemas (no database, no server-only). */
import { z } from "zod";
import type { Severity } from "./enums";

const reason = z.string().trim().min(10, "Give the reason in at least 10 characters.").max(2000);
const rule = z.string().trim().min(1, "Pick a rule.");

export const overrideInputSchema = z.discriminatedUnion("action", [
  z.object({
    action: z.literal("set"),
    rule,
    severity: z.enum(["error", "warning", "info"]).nullable().default(null),
    options: z.record(z.string(), z.unknown()).nullable().default(null),
    reason,
  }),
  z.object({
    action: z.literal("clear"),
    rule,
    reason,
  }),
]);

export type OverrideInput = z.infer<typeof overrideInputSchema>;

export interface OverrideDto {
  id: number;
  rule: string;
  defaultSeverity: Severity;
  severity: Severity | null;
  options: Record<string, unknown> | null;
  cleared: boolean;
  reason: string;
  setBy: string;
  setAt: string;
}
