// The body of PATCH /api/users/[id]: one zod schema types the route handler and drives the form.
import { z } from "zod";
import { ROLE_NAMES } from "@/lib/auth/roles";
import { idParam } from "@/lib/api/ids";

export const roleChangeSchema = z.object({
  role: z.enum(ROLE_NAMES, { error: `role must be one of ${ROLE_NAMES.join(", ")}` }),
});
export type RoleChange = z.infer<typeof roleChangeSchema>;

export const userIdSchema = z.object({
  id: idParam("id"),
});
