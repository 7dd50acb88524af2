/** The enumerations every layer shares: finding severities, thread states and the roles. */
export const severities = ["error", "warning", "info"] as const;
export type Severity = (typeof severities)[number];

export const threadStatuses = ["open", "waived", "resolved", "reopened"] as const;
export type ThreadStatusName = (typeof threadStatuses)[number];

export { roles, roleLabels, type Role } from "@/lib/roles";
