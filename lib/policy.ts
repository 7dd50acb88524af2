/** Who may do what: the one table every lib/db mutation and route handler consults. */
import type { Role } from "./roles";

export const can = {
  createProject: ["manager"],
  assignChecker: ["manager"],
  manageUsers: ["admin"],
  createLayout: ["designer"],
  uploadRevision: ["designer"],
  comment: ["designer", "checker"],
  waive: ["checker"],
  reopen: ["checker"],
  requestRelease: ["designer"],
  withdrawRelease: ["designer"],
  approveRelease: ["checker"],
  manageTokens: ["designer", "checker", "manager", "admin"],
  readMailOutbox: ["admin"],
  overrideRules: ["admin"],
  manageMaterials: ["admin", "manager"],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof can;

/** Whether a role may take an action. */
export function allowed(role: Role, action: Action): boolean {
  return (can[action] as readonly Role[]).includes(role);
}
