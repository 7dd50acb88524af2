/** Projects page: the list (fetched in the client) and, for managers, the create form. */
import type { Metadata } from "next";
import { requirePageUser } from "@/lib/auth/session";
import { ProjectsView } from "@/components/projects/projects-view";
import { listUsersByRole } from "@/lib/db/users";

export const metadata: Metadata = { title: "Projects" };

export default async function ProjectsPage() {
  const user = await requirePageUser("/projects");
  const checkers = user.role === "manager" ? await listUsersByRole("checker") : [];
  return <ProjectsView canCreate={user.role === "manager"} checkers={checkers.map((c) => ({ id: c.id, name: c.name }))} />;
}
