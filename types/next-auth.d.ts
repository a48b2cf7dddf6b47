import type { DefaultSession } from "next-auth";
import type { Role } from "@/lib/auth/roles";

declare module "next-auth" {
  interface User {
    id: string;
    roles: Role[];
  }
  interface Session {
    user: { id: string; roles: Role[] } & DefaultSession["user"];
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid: string;
    roles: Role[];
  }
}
