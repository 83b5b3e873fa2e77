import { describe, expect, it } from "vitest";
import { paths } from "@/app/paths";
import { safeNext } from "./safe-next";

describe("safeNext", () => {
  it("keeps a path on this site with its query and fragment", () => {
    expect(safeNext("/plans/abc?tab=review#c1")).toBe("/plans/abc?tab=review#c1");
  });

  it.each<[string | null, string]>([
    ["/\\evil.test", "a backslash that browsers read as //"],
    ["/\\/evil.test", "backslash then slash"],
    ["//evil.test", "a protocol-relative URL"],
    ["https://evil.test/", "an absolute URL"],
    ["javascript:alert(1)", "a script URL"],
    ["/\tevil", "a control character"],
    ["plans", "a relative path"],
    ["", "nothing"],
    [null, "no parameter"],
  ])("sends %j (%s) to the sites list", (next) => {
    expect(safeNext(next)).toBe(paths.sites);
  });
});
