import { ESLint } from "eslint";
import { describe, expect, it } from "vitest";

// The floors of DEVELOPERS.md ("Which folder may import which") are kept by eslint.config.mjs.
// These lint a made-up file at a path on each floor, so a change to the config that stops
// catching an import running up a floor fails here, not in review.
const eslint = new ESLint({ cwd: process.cwd() });

async function floorErrors(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages
    .filter((m) => m.ruleId === "@typescript-eslint/no-restricted-imports")
    .map((m) => m.message);
}

describe("import floors", () => {
  it("refuses the database, server code and server-only in lib/", async () => {
    const errors = await floorErrors(
      "lib/results/floor-probe.ts",
      [
        'import { db } from "@/db";',
        'import type { Db } from "../../db/client";',
        'import { runAction } from "@/server/actions/run";',
        'import "server-only";',
        "export const probe = [db, runAction] as unknown as Db;",
      ].join("\n"),
    );
    expect(errors).toHaveLength(4);
  });

  it("lets lib/cli, the command-line entry points, open the database", async () => {
    const errors = await floorErrors(
      "lib/cli/floor-probe.ts",
      'import { openDatabase } from "../../db/client";\nexport const probe = openDatabase;\n',
    );
    expect(errors).toEqual([]);
  });

  it("refuses server code and mail in db/", async () => {
    const errors = await floorErrors(
      "db/queries/floor-probe.ts",
      [
        'import { deliverMail } from "@/server/mail/queue";',
        'import { commentMail } from "@/lib/mail/messages";',
        "export const probe = [deliverMail, commentMail];",
      ].join("\n"),
    );
    expect(errors).toHaveLength(2);
  });

  it("refuses routes and the database in components/, but not a row type", async () => {
    const errors = await floorErrors(
      "components/cases/floor-probe.tsx",
      [
        'import { metadata } from "@/app/layout";',
        'import { db } from "@/db";',
        'import type { Axis } from "@/db/schema";',
        "export const probe = [metadata, db] as unknown as Axis;",
      ].join("\n"),
    );
    expect(errors).toHaveLength(2);
  });

  it("lets server/ use the database and lib/", async () => {
    const errors = await floorErrors(
      "server/cases/floor-probe.ts",
      'import { db } from "@/db";\nimport { VENDOR_ROLES } from "@/lib/auth/roles";\nexport const probe = [db, VENDOR_ROLES];\n',
    );
    expect(errors).toEqual([]);
  });
});
