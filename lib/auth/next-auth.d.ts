// The session and token carry the user's id, role and (customer users) company id.
import type { Role } from "@/lib/domain/roles";

declare module "next-auth" {
  interface User {
    id: string;
    role: Role;
    customerId: string | null;
  }
  interface Session {
    user: {
      id: string;
      email: string;
      name: string;
      role: Role;
      customerId: string | null;
      signedInAt: number;
    };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    role?: Role;
    customerId?: string | null;
    /** Milliseconds since the epoch when this session signed in. */
    signedInAt?: number;
  }
}
