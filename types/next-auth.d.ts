import type { FirmRole, ProjectRole } from "@/lib/auth/roles";

declare module "next-auth" {
  interface Session {
    user: {
      id: string;
      name: string;
      email: string;
      firmRoles: { firmId: string; role: FirmRole }[];
      clientRoles: ProjectRole[];
    };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    userId: string;
    firmRoles?: { firmId: string; role: FirmRole }[];
    clientRoles?: ProjectRole[];
  }
}
