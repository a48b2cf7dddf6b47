import { z } from "zod";
import { lineText } from "./text";
import { SELF_SERVICE_ROLES } from "../auth/roles";

/** Shared by the sign-up form and POST /api/account/sign-up. */
export const SignUpSchema = z.object({
  displayName: lineText().trim().min(2, "Enter a name of at least 2 characters").max(80, "At most 80 characters"),
  email: z.email("Enter a valid e-mail address").max(254),
  password: z.string().min(10, "Use at least 10 characters").max(200, "At most 200 characters"),
  role: z.enum(SELF_SERVICE_ROLES, { message: "Choose consignor or dealer" }),
});
export type SignUpInput = z.infer<typeof SignUpSchema>;

/** What sign-in tells the owner of an account whose address is not confirmed yet (service and form). */
export const UNCONFIRMED_MESSAGE =
  "Confirm your e-mail address first: open the link we sent when you signed up. To get a new link, sign up again with the same address.";

/** Shared by the sign-in form and the credentials check. */
export const SignInSchema = z.object({
  email: z.email("Enter a valid e-mail address").max(254),
  password: z.string().min(1, "Enter your password").max(200),
});
export type SignInInput = z.infer<typeof SignInSchema>;

/** Shared by the forgotten-password form and POST /api/account/password-reset. */
export const ResetRequestSchema = z.object({ email: z.email("Enter a valid e-mail address").max(254) });
export type ResetRequestInput = z.infer<typeof ResetRequestSchema>;

/** Shared by the new-password form and POST /api/account/password-reset/confirm. */
export const ResetConfirmSchema = z
  .object({
    token: z.string().min(20).max(200),
    password: z.string().min(10, "Use at least 10 characters").max(200),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { message: "The two passwords differ", path: ["confirm"] });
export type ResetConfirmInput = z.infer<typeof ResetConfirmSchema>;

/** Shared by the confirm-address page and POST /api/account/confirm-email. */
export const ConfirmEmailSchema = z.object({
  token: z
    .string()
    .regex(
      /^[\w-]{20,200}$/,
      "This page needs the link from the e-mail, whole. To get a new one, sign up again with the same address.",
    ),
});
export type ConfirmEmailInput = z.infer<typeof ConfirmEmailSchema>;

/** Shared by the house's user table and PATCH /api/admin/users/:id. */
export const RolesUpdateSchema = z.object({
  roles: z.array(z.enum(["consignor", "dealer", "mediator", "admin"])).max(4),
});
export type RolesUpdateInput = z.infer<typeof RolesUpdateSchema>;
