import "server-only";
// next-auth configuration: JWT sessions, two Credentials providers ("password" and "link").
// Errors thrown from authorize reach the sign-in form as their message.
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { ready } from "@/db";
import { AppError } from "./errors";
import { redeemSignInLink, signInWithPassword } from "./sign-in";
import { findUserById } from "./users";

declare module "next-auth" {
  interface Session {
    user: { id: string; email: string; name: string };
  }
}

function asAuthError(err: unknown): Error {
  if (err instanceof AppError) return new Error(err.message);
  console.error(err);
  return new Error("Signing in failed on the server. Try again in a moment.");
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: 60 * 60 * 24 * 30 },
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
      async authorize(credentials) {
        const email = typeof credentials?.email === "string" ? credentials.email : "";
        const password = typeof credentials?.password === "string" ? credentials.password : "";
        try {
          const user = await signInWithPassword(await ready(), email, password);
          return { id: user.id, email: user.email, name: user.name };
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
          return { id: user.id, email: user.email, name: user.name };
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
      }
      return token;
    },
    // A token can outlive its account (a fresh demo database, a deleted user): such a session
    // carries no user id, so the app treats the caller as signed out instead of failing later.
    async session({ session, token }) {
      const user = token.sub ? await findUserById(await ready(), token.sub) : undefined;
      session.user = user
        ? { id: user.id, email: user.email, name: user.name }
        : { id: "", email: "", name: "" };
      return session;
    },
  },
};
