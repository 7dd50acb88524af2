/** Sign-out page: one button, then back to sign-in. */
import type { Metadata } from "next";
import { SignOutButton } from "@/components/auth/sign-out-button";

export const metadata: Metadata = { title: "Sign out" };

export default function SignOutPage() {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center px-6">
      <div className="sheet p-6">
        <h1 className="mb-2 text-lg">Sign out of Sixfold?</h1>
        <p className="mb-4 text-sm text-graphite-soft">Open review threads stay as they are.</p>
        <SignOutButton />
      </div>
    </main>
  );
}
