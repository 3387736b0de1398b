import { describe, expect, it } from "vitest";
import { machineInputSchema } from "@/lib/validations/installed-base";

// The machine form validates in the browser and hands the parsed values to the server action,
// which parses them again with the same schema: what the first parse gives must pass the second.
describe("machine input parsed twice (form, then server action)", () => {
  it("accepts a machine with no line", () => {
    const once = machineInputSchema.parse({ name: "Cup filler 1", line: "" });
    expect(once.line).toBeNull();
    expect(machineInputSchema.parse(once)).toEqual(once);
  });

  it("keeps a line that was given and names the field when it is too long", () => {
    expect(machineInputSchema.parse({ name: "Cup filler 1", line: " Line 2 " }).line).toBe(
      "Line 2",
    );
    const result = machineInputSchema.safeParse({ name: "Cup filler 1", line: "x".repeat(121) });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0].message).toMatch(/^Line:/);
  });
});
