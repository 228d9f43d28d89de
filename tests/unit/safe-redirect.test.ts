import { describe, expect, it } from "vitest";
import { safeCallbackPath } from "@/lib/safe-redirect";

describe("sign-in callback paths", () => {
  it.each([
    ["/c/123", "/c/123"],
    ["/", "/"],
    [undefined, "/"],
    ["https://elsewhere.example/", "/"],
    ["//elsewhere.example/x", "/"],
    ["/\\elsewhere.example", "/"],
    ["javascript:alert(1)", "/"],
    ["/c/1\n", "/"],
  ])("%j → %j", (input, out) => {
    expect(safeCallbackPath(input)).toBe(out);
  });
});
