/** Sign-in page in Sixfold's own design. */
import type { Metadata } from "next";
import { Mark } from "@/components/ui/mark";
import { SignInForm } from "@/components/auth/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string }> }) {
  const { callbackUrl } = await searchParams;
  const safe = callbackUrl && callbackUrl.startsWith("/") && !callbackUrl.startsWith("//") ? callbackUrl : "/projects";
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center px-6">
      <div className="mb-6 flex items-center gap-3">
        <Mark size={36} />
        <div>
          <div className="text-xl font-semibold tracking-tight">Sixfold</div>
          <div className="text-sm text-graphite-soft">Exact-constraint review for precision mounts</div>
        </div>
      </div>
      <div className="sheet p-6">
        <h1 className="mb-4 text-lg">Sign in</h1>
        <SignInForm callbackUrl={safe} />
      </div>
    </main>
  );
}
