import "server-only";
// next-auth configuration: JWT sessions, two Credentials providers ("password" and "link").
// Errors thrown from authorize reach the sign-in form as their message.
// Each token carries its own session id and the user's session version, checked on every request
// (session-version.ts), so signing out, a password change or "sign out everywhere" end it for real.
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { randomUUID } from "node:crypto";
import { ready } from "@/db";
import { safeRedirect } from "@/lib/validation/callback";
import { AppError } from "./errors";
import { endSession, isSessionLive } from "./session-version";
import { redeemSignInLink, signInWithPassword } from "./sign-in";
import { findUserById } from "./users";

declare module "next-auth" {
  interface Session {
    user: { id: string; email: string; name: string };
  }
  interface User {
    sessionVersion?: number;
  }
}

const MAX_AGE_S = 60 * 60 * 24 * 30;

function asAuthError(err: unknown): Error {
  if (err instanceof AppError) return new Error(err.message);
  console.error(err);
  return new Error("Signing in failed on the server. Try again in a moment.");
}

/** The client key of a next-auth request (its headers arrive as a plain object). */
function clientOf(req: { headers?: Record<string, unknown> } | undefined): string {
  const xff = req?.headers?.["x-forwarded-for"];
  const last = typeof xff === "string" ? xff.split(",").pop()?.trim() : undefined;
  return (last || "unknown").slice(0, 64);
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: MAX_AGE_S },
  pages: { signIn: "/signin", error: "/signin" },
  secret: process.env.NEXTAUTH_SECRET,
  providers: [
    CredentialsProvider({
      id: "password",
      name: "Email and password",
      credentials: {
        email: { label: "Email", type: "email" },
        password: { label: "Password", type: "password" },
      },
      async authorize(credentials, req) {
        const email = typeof credentials?.email === "string" ? credentials.email : "";
        const password = typeof credentials?.password === "string" ? credentials.password : "";
        try {
          const user = await signInWithPassword(await ready(), email, password, new Date(), clientOf(req));
          return { id: user.id, email: user.email, name: user.name, sessionVersion: user.sessionVersion };
        } catch (err) {
          throw asAuthError(err);
        }
      },
    }),
    CredentialsProvider({
      id: "link",
      name: "Sign-in link",
      credentials: { token: { label: "Token", type: "text" } },
      async authorize(credentials) {
        const token = typeof credentials?.token === "string" ? credentials.token : "";
        if (!token) throw new Error("That sign-in link is not valid. Ask for a new one.");
        try {
          const user = await redeemSignInLink(await ready(), token);
          return { id: user.id, email: user.email, name: user.name, sessionVersion: user.sessionVersion };
        } catch (err) {
          throw asAuthError(err);
        }
      },
    }),
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.sub = user.id;
        token.email = user.email;
        token.name = user.name;
        token.sv = user.sessionVersion ?? 0;
        token.sid = randomUUID();
      }
      return token;
    },
    // A token can outlive its account (a fresh demo database, a deleted user) or its session (signed
    // out, password changed): such a session carries no user id, so the app treats the caller as
    // signed out instead of failing later.
    async session({ session, token }) {
      const db = await ready();
      const user = token.sub ? await findUserById(db, token.sub) : undefined;
      const claims = { userId: token.sub ?? "", version: typeof token.sv === "number" ? token.sv : 0, sid: typeof token.sid === "string" ? token.sid : null };
      const live = user ? await isSessionLive(db, claims, user.session_version) : false;
      session.user = user && live ? { id: user.id, email: user.email, name: user.name } : { id: "", email: "", name: "" };
      return session;
    },
    // After sign-in or sign-out only this site's own paths, whatever callbackUrl said.
    redirect({ url, baseUrl }) {
      return safeRedirect(url, baseUrl);
    },
  },
  events: {
    // Signing out ends this session on the server too, so a copy of the cookie stops working.
    async signOut({ token }) {
      if (!token?.sub) return;
      const claims = { userId: token.sub, version: typeof token.sv === "number" ? token.sv : 0, sid: typeof token.sid === "string" ? token.sid : null };
      const ends = typeof token.exp === "number" ? new Date(token.exp * 1000) : new Date(Date.now() + MAX_AGE_S * 1000);
      await endSession(await ready(), claims, ends);
    },
  },
};
