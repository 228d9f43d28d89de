import { describe, expect, it } from "vitest";
import { episodeCreateSchema, episodeUpdateSchema, minutesTextToSeconds, secondsToMinutesText } from "@/lib/schemas/episode";
import { invitationCreateSchema } from "@/lib/schemas/account";
import { FRAME_RATES, FRAME_RATE_IDS } from "@/lib/frame-rate";

describe("episode schemas", () => {
  it("fills defaults for a bare title", () => {
    const v = episodeCreateSchema.parse({ title: "  Step stool  " });
    expect(v).toMatchObject({ title: "Step stool", stage: "idea", frameRate: "29.97", dropFrame: false, publishDate: null });
  });

  it("names the field and the reason", () => {
    const r = episodeCreateSchema.safeParse({ title: "", publishDate: "2026-02-30", targetRuntimeSeconds: 5 });
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["title", "publishDate", "targetRuntimeSeconds"]));
    expect(r.error!.issues.find((i) => i.path[0] === "publishDate")!.message).toBe("is not a real date");
  });

  // SMPTE ST 12-1: drop-frame labelling exists only for 30000/1001 (and, by common
  // software practice, 60000/1001); never at 23.976, 24, 25, 30, 50 or 60.
  it.each(FRAME_RATE_IDS)("drop-frame at %s fps is %s", (rate) => {
    const ok = episodeCreateSchema.safeParse({ title: "t", frameRate: rate, dropFrame: true }).success;
    expect(ok).toBe(rate === "29.97" || rate === "59.94");
  });

  // Exact rates from the MPEG-2 frame_rate_code table (ISO/IEC 13818-2).
  it("keeps the NTSC-family rates as exact rationals", () => {
    expect(FRAME_RATES["23.976"]).toMatchObject({ num: 24000, den: 1001 });
    expect(FRAME_RATES["29.97"]).toMatchObject({ num: 30000, den: 1001 });
    expect(FRAME_RATES["59.94"]).toMatchObject({ num: 60000, den: 1001 });
    expect(FRAME_RATES["25"]).toMatchObject({ num: 25, den: 1 });
  });

  it("refuses an empty or unknown patch", () => {
    expect(episodeUpdateSchema.safeParse({}).success).toBe(false);
    expect(episodeUpdateSchema.safeParse({ colour: "red" }).success).toBe(false);
    expect(episodeUpdateSchema.safeParse({ stage: "nowhere" }).success).toBe(false);
    expect(episodeUpdateSchema.safeParse({ position: -1 }).success).toBe(false);
    expect(episodeUpdateSchema.safeParse({ stage: "editing", position: 0 }).success).toBe(true);
  });

  it("converts runtime text both ways", () => {
    expect(minutesTextToSeconds("14:30")).toBe(870);
    expect(minutesTextToSeconds("9")).toBe(540);
    expect(minutesTextToSeconds("")).toBeNull();
    expect(secondsToMinutesText(870)).toBe("14:30");
    expect(secondsToMinutesText(540)).toBe("9");
  });
});

describe("invitation schema", () => {
  it("lower-cases e-mail and needs a role", () => {
    expect(invitationCreateSchema.parse({ email: "New.Person@Example.COM ", roles: ["editor"] }).email).toBe("new.person@example.com");
    const r = invitationCreateSchema.safeParse({ email: "nope", roles: [] });
    expect(r.error!.issues.map((i) => i.path[0])).toEqual(expect.arrayContaining(["email", "roles"]));
  });
});
