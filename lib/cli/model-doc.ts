import fs from "node:fs";
import path from "node:path";
import { methodMarkdown } from "@/lib/method/markdown";

// Writes docs/model.md from the method page's text; a unit test fails when the two drift apart.
const target = path.resolve("docs/model.md");
fs.mkdirSync(path.dirname(target), { recursive: true });
fs.writeFileSync(target, methodMarkdown());
console.log(`wrote ${path.relative(process.cwd(), target)}`);
