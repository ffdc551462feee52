// The demo sign-ins (README lists them). Demo only: change the password outside a demo.
import type { Role } from "../schema";

export const DEMO_PASSWORD = "sightward-demo";

export interface DemoAccount {
  email: string;
  name: string;
  role: Role;
}

/** One account per role; guard@example.org is also a seeded guard (see museum.ts). */
export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  { email: "admin@example.org", name: "Helga Marquardt", role: "admin" },
  { email: "operations@example.org", name: "Viktor Lindner", role: "operations" },
  { email: "curator@example.org", name: "Selma Okonkwo", role: "curator" },
  { email: "guard@example.org", name: "Mara Lindqvist", role: "guard" },
];
