import type { Role } from "./roles";

declare module "next-auth" {
  interface Session {
    user: {
      id: number;
      email: string;
      name: string;
      role: Role;
      accountId: number | null;
      sessionVersion: number | null;
    };
  }
  interface User {
    id: string;
    role: Role;
    accountId: number | null;
    sessionVersion: number;
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid?: number;
    role?: Role;
    accountId?: number | null;
    sv?: number;
  }
}
