"use client";
/** E-mail and password form; a wrong password is answered in plain words, and the typed e-mail is kept. */
import { signIn } from "next-auth/react";
import { useState } from "react";

export function SignInForm({ callbackUrl }: { callbackUrl: string }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setBusy(true);
    setError(null);
    const res = await signIn("credentials", {
      redirect: false,
      email: String(form.get("email") ?? ""),
      password: String(form.get("password") ?? ""),
    });
    setBusy(false);
    if (res?.ok && !res.error) {
      window.location.assign(callbackUrl);
    } else if (res?.error === "TOO_MANY_ATTEMPTS") {
      setError("Too many failed attempts for this e-mail. Wait five minutes, then try again.");
    } else {
      setError("That e-mail and password do not match an account. Check both and try again.");
    }
  }

  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <div>
        <label htmlFor="email" className="label">
          E-mail
        </label>
        <input id="email" name="email" type="email" autoComplete="username" required className="field" />
      </div>
      <div>
        <label htmlFor="password" className="label">
          Password
        </label>
        <input id="password" name="password" type="password" autoComplete="current-password" required className="field" />
      </div>
      {error && (
        <p role="alert" className="rounded-sm border border-severity-error/40 bg-severity-error-bg px-3 py-2 text-sm text-severity-error">
          {error}
        </p>
      )}
      <button type="submit" className="btn w-full justify-center" disabled={busy}>
        {busy ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
