// Sightward's session carries the user's id and role (set in lib/auth/options.ts callbacks).
import type { DefaultSession } from "next-auth";
import type { Role } from "@/db/schema";

declare module "next-auth" {
  interface Session {
    user: {
      id: number;
      role: Role;
      name: string;
      email: string;
    } & Omit<DefaultSession["user"], "name" | "email">;
  }
  interface User {
    id: string;
    role: Role;
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid?: number;
    role?: Role;
    /** When the password was given (seconds since the epoch); lib/auth/session-policy.ts. */
    signedInAt?: number;
  }
}
