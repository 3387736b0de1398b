import { z } from "zod";
import { money, torque, atLeast } from "@/lib/engine/schema-fields";
function bench(name: string, s: z.ZodType, v: unknown) {
  const arr = z.array(z.object({ x: s }));
  const data = Array.from({ length: 40000 }, () => ({ x: v }));
  const ts: number[] = [];
  for (let k = 0; k < 7; k++) { const t = performance.now(); arr.parse(data); ts.push(performance.now() - t); }
  ts.sort((a, b) => a - b); console.log(name, ts[3].toFixed(1), "ms per 40k");
}
bench("num", atLeast(0), 1);
bench("numdefault", atLeast(0).default(0), undefined);
bench("money str", money(), "12.5");
bench("money undefined default", money().default("0" as never), undefined);
bench("torque num", torque(), 1.2);
bench("torque obj", torque(), { value: 1, unit: "oz-in" });
bench("str regex", z.string().regex(/^\d+$/), "125");
bench("custom", z.custom((v) => typeof v === "string"), "125");
bench("transform", z.string().transform((v) => v + "1"), "125");
bench("union2", z.union([z.string(), z.number()]), 1);
