/** Contracts of the token API's findings read: the query and the answer. */
import { z } from "zod";
import type { Severity, ThreadStatusName } from "./enums";

export const findingStatusQuerySchema = z.object({ status: z.enum(["open", "waived", "resolved", "reopened", "all"]).default("open") });
export type FindingStatusFilter = z.infer<typeof findingStatusQuerySchema>["status"];

export interface ApiFindingDto {
  id: number;
  rule: string;
  severity: Severity;
  title: string;
  status: ThreadStatusName;
  contacts: string[];
  loadCase: string | null;
  body: string;
}
