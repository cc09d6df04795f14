// Display of fitted numbers: decimals, the minus sign and zero. The minus sign is U+2212 MINUS
// SIGN, the character ISO 80000-2 gives for negative values (from memory), not the hyphen; a
// value that rounds to zero carries no sign (common practice: printed tables never show −0).
import { describe, expect, it } from "vitest";
import { fixed, signed } from "@/lib/numbers";

describe("fixed", () => {
  it("keeps the decimals and uses a real minus sign", () => {
    expect(fixed(812.5, 4)).toBe("812.5000");
    expect(fixed(-0.0123, 4)).toBe("−0.0123");
  });
  it("shows a negative value that rounds to zero without a sign", () => {
    expect(fixed(-0.00000123, 4)).toBe("0.0000");
    expect(fixed(-0, 2)).toBe("0.00");
    expect(fixed(-0.00005001, 4)).toBe("−0.0001");
  });
});

describe("signed", () => {
  it("always shows the sign of a value that does not round to zero", () => {
    expect(signed(18.17, 2)).toBe("+18.17");
    expect(signed(-8.7, 2)).toBe("−8.70");
    expect(signed(-0.001, 2)).toBe("0.00");
  });
});
