import fs from "node:fs";
import path from "node:path";

export type PageRoute = { template: string; pattern: RegExp };

// Every page of the app, read from the app/ folder itself (each page.tsx is one route): route
// groups such as "(app)" add nothing to the address and "[id]" stands for one path segment.
// A check that walks "every page" compares what it visited against this list, so a new page
// shows up here without anyone remembering to add it.
export function appPageRoutes(appDir = path.resolve("app")): PageRoute[] {
  const routes: PageRoute[] = [];
  const walk = (dir: string, segments: string[]) => {
    for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
      if (entry.isDirectory()) walk(path.join(dir, entry.name), [...segments, entry.name]);
      else if (entry.name === "page.tsx") {
        const parts = segments.filter((s) => !/^\(.*\)$/.test(s));
        const template = "/" + parts.join("/");
        const source = parts.map((s) => (/^\[.*\]$/.test(s) ? "[^/]+" : escape(s))).join("/");
        routes.push({ template, pattern: new RegExp(`^/${source}$`) });
      }
    }
  };
  walk(appDir, []);
  // Literal segments win over parameters ("/catalogue/kits/new" is not a kit id).
  return routes.sort((a, b) => countParams(a.template) - countParams(b.template));
}

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
const countParams = (t: string) => (t.match(/\[/g) ?? []).length;

export function routeOf(routes: PageRoute[], pathname: string): PageRoute | undefined {
  return routes.find((r) => r.pattern.test(pathname));
}
