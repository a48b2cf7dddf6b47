import type { DefaultSession } from "next-auth";
import type { Role } from "@/lib/auth/roles";

declare module "next-auth" {
  interface User {
    id: string;
    roles: Role[];
    /** The account's session version at sign-in (users.session_version). */
    sessionVersion: number;
  }
  interface Session {
    user: { id: string; roles: Role[]; sv?: number } & DefaultSession["user"];
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid: string;
    roles: Role[];
    /** Session version at sign-in; the guards compare it with the database on every request. */
    sv?: number;
  }
}
