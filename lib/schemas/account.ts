import { z } from "zod";
import { ROLES } from "../roles";
import { timeZoneSchema } from "./shoot";

export const emailSchema = z.string().trim().toLowerCase().pipe(z.email({ message: "must be an e-mail address" }));
export const passwordSchema = z
  .string()
  .min(10, "use at least 10 characters")
  .max(200, "use at most 200 characters");
export const rolesSchema = z
  .array(z.enum(ROLES))
  .min(1, "choose at least one role")
  .refine((r) => new Set(r).size === r.length, "list each role once");

export const signInSchema = z.object({ email: emailSchema, password: z.string().min(1, "enter your password") });

export const invitationCreateSchema = z
  .object({ email: emailSchema, roles: rolesSchema })
  .strict()
  .meta({ id: "InvitationCreate" });

export const invitationAcceptSchema = z
  .object({
    token: z.string().min(20, "the link is incomplete").max(200),
    name: z.string().trim().min(1, "tell the team your name").max(80),
    password: passwordSchema,
  })
  .strict()
  .meta({ id: "InvitationAccept" });

export const resetRequestSchema = z.object({ email: emailSchema }).strict().meta({ id: "PasswordResetRequest" });
export const resetConfirmSchema = z
  .object({ token: z.string().min(20, "the link is incomplete").max(200), password: passwordSchema })
  .strict()
  .meta({ id: "PasswordResetConfirm" });

export const memberRolesSchema = z.object({ roles: rolesSchema }).strict().meta({ id: "MemberRoles" });

export const channelUpdateSchema = z
  .object({
    name: z.string().trim().min(1, "give the channel a name").max(80),
    units: z.enum(["imperial", "metric"]),
    currency: z.string().regex(/^[A-Z]{3}$/, "use a 3-letter currency code such as USD"),
    brollGapMs: z.number().int("whole milliseconds").min(0, "cannot be negative").max(60_000, "at most 60 s"),
    toCameraMaxMs: z.number().int("whole milliseconds").min(1000, "at least 1 s").max(600_000, "at most 10 minutes"),
    timeZone: timeZoneSchema,
  })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .meta({ id: "ChannelUpdate" });

// ---- Responses: one schema per resource, used by the handlers (typed), the OpenAPI document and the browser.

export const channelSchema = z.object({ id: z.string(), name: z.string(), roles: z.array(z.enum(ROLES)), units: z.string(), currency: z.string() });
export type ChannelDto = z.infer<typeof channelSchema>;
export const channelSettingsSchema = z.object({ id: z.string(), name: z.string(), units: z.enum(["imperial", "metric"]), currency: z.string(), brollGapMs: z.number(), toCameraMaxMs: z.number(), timeZone: z.string() }).meta({ id: "ChannelSettings" });
export type ChannelSettingsDto = z.infer<typeof channelSettingsSchema>;
export const memberSchema = z.object({ userId: z.string(), name: z.string(), email: z.string(), roles: z.array(z.enum(ROLES)), joinedAt: z.string() });
export type MemberDto = z.infer<typeof memberSchema>;
export const invitationSchema = z.object({ id: z.string(), email: z.string(), roles: z.array(z.enum(ROLES)), expiresAt: z.string(), createdAt: z.string().optional() });
export type InvitationDto = z.infer<typeof invitationSchema>;
export const mailSchema = z.object({
  id: z.string(),
  kind: z.string().nullable(),
  fromAddress: z.string(),
  toAddresses: z.array(z.string()),
  subject: z.string(),
  textBody: z.string(),
  attachments: z.array(z.object({ filename: z.string(), contentType: z.string(), size: z.number(), sha256: z.string() })),
  receivedAt: z.string(),
});
export type MailDto = z.infer<typeof mailSchema>;
