/** A project: its layouts and their review state; designers add layouts. */
import type { Metadata } from "next";
import { requirePageUser } from "@/lib/auth/session";
import { allowed } from "@/lib/policy";
import { ProjectView } from "@/components/projects/project-view";
import { listUsersByRole } from "@/lib/db/users";

export const metadata: Metadata = { title: "Project" };

export default async function ProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const user = await requirePageUser(`/projects/${projectId}`);
  const canAssign = allowed(user.role, "assignChecker");
  const checkers = canAssign ? (await listUsersByRole("checker")).map((c) => ({ id: c.id, name: c.name })) : [];
  return (
    <ProjectView
      projectId={Number(projectId)}
      canCreate={allowed(user.role, "createLayout")}
      canOverride={allowed(user.role, "overrideRules")}
      canAssign={canAssign}
      canEditMaterials={allowed(user.role, "manageMaterials")}
      checkers={checkers}
    />
  );
}
