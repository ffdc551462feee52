// Account forms and routes share these schemas (pure zod).
import { z } from "zod";
import { ROLE_NAMES } from "@/lib/auth/roles";

export const inviteSchema = z.object({
  name: z.string({ error: "give the person's name" }).trim().min(1, "give the person's name").max(120, "keep the name under 120 characters"),
  email: z.string().trim().toLowerCase().email("give an e-mail address such as name@example.org").max(254),
  role: z.enum(ROLE_NAMES, { error: `the role is one of ${ROLE_NAMES.join(", ")}` }),
});
export type InviteInput = z.input<typeof inviteSchema>;

export const accessSchema = z.object({ disabled: z.boolean({ error: "say whether the account is disabled (true or false)" }) });

/** At least 12 characters (NIST SP 800-63B asks for 8 or more; 12 is our choice), at most 200. */
export const newPasswordSchema = z.object({
  token: z.string().min(20, "the link is incomplete; open it from the mail again").max(200),
  password: z.string().min(12, "choose a password of at least 12 characters").max(200, "keep the password under 200 characters"),
});
