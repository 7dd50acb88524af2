/** next-auth configuration: e-mail + password (bcrypt) credentials, JWT session carrying user id and role. */
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { z } from "zod";
import { verifyCredentials } from "@/lib/db/users";
import { isLocked, recordFailure, recordSuccess } from "./rate-limit";
import type { Role } from "@/lib/roles";

const credentialsSchema = z.object({
  email: z.string().trim().email(),
  password: z.string().min(1).max(200),
});

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 12 * 60 * 60 },
  // session cookies are httpOnly and SameSite=Lax; Secure whenever the site is served over https
  useSecureCookies: (process.env.NEXTAUTH_URL ?? "").startsWith("https://"),
  pages: { signIn: "/signin", signOut: "/signout", error: "/signin" },
  providers: [
    CredentialsProvider({
      name: "Sixfold account",
      credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(raw) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        const key = parsed.data.email.trim().toLowerCase();
        if (isLocked(key)) throw new Error("TOO_MANY_ATTEMPTS");
        const user = await verifyCredentials(parsed.data.email, parsed.data.password);
        if (!user) {
          if (recordFailure(key)) throw new Error("TOO_MANY_ATTEMPTS");
          return null;
        }
        recordSuccess(key);
        return { id: String(user.id), email: user.email, name: user.name, role: user.role };
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.uid = Number(user.id);
        token.role = (user as unknown as { role: Role }).role;
      }
      return token;
    },
    async session({ session, token }) {
      if (session.user) {
        session.user.id = token.uid as number;
        session.user.role = token.role as Role;
      }
      return session;
    },
  },
};
