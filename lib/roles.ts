/** The four roles of Sixfold and what each may do. */
export const roles = ["designer", "checker", "manager", "admin"] as const;
export type Role = (typeof roles)[number];

export const roleLabels: Record<Role, string> = {
  designer: "Designer",
  checker: "Checker",
  manager: "Manager",
  admin: "Administrator",
};
