/**
 * The Auth.js instance: `auth()` reads the session in server components and
 * actions, `handlers` serve /api/auth/*, `signIn`/`signOut` for server actions.
 * Initialised lazily so importing it never reads the environment.
 */
import NextAuth from "next-auth";
import { authConfig } from "./config";

export const { handlers, auth, signIn, signOut } = NextAuth(() => authConfig());
