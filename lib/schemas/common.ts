import { z } from "zod";

export const errorResponseSchema = z
  .object({
    error: z.object({
      code: z.string().meta({ example: "validation" }),
      message: z.string(),
      fields: z.record(z.string(), z.array(z.string())).optional(),
    }),
  })
  .meta({ id: "Error" });

export const okSchema = z.object({ ok: z.literal(true) }).meta({ id: "Ok" });
