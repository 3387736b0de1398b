import { AppRouterContext } from "next/dist/shared/lib/app-router-context.shared-runtime";
import { PathnameContext } from "next/dist/shared/lib/hooks-client-context.shared-runtime";
import { createElement, type ReactNode } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import type { SessionUser } from "@/lib/auth/session-user";
import { asRequestOf } from "./next-request";

// The client parts of a page need the App Router's context, which only `next start` provides: an
// inert router stands in for it, so a server page's markup can be read in-process. Load
// ./node-async-storage first in the test file, as Next.js reads its request storage on load.
const noop = () => {};
const inertRouter = {
  back: noop,
  forward: noop,
  refresh: noop,
  push: noop,
  replace: noop,
  prefetch: noop,
};

/** `node` under the inert router; with `pathname`, the path the shell's menu marks as current
 * (without it, there is no path, as outside a page). */
export function withInertRouter(node: ReactNode, pathname?: string): ReactNode {
  const inner =
    pathname === undefined
      ? node
      : createElement(PathnameContext.Provider, { value: pathname }, node);
  return createElement(AppRouterContext.Provider, { value: inertRouter as never }, inner);
}

/** The static markup of `node` under the inert router (see withInertRouter). */
export function renderWithRouter(node: ReactNode, pathname?: string): string {
  return renderToStaticMarkup(withInertRouter(node, pathname));
}

/** Renders a server page (or layout) as one request of `user`, then its markup as above. */
export async function renderPageAs(
  user: SessionUser | null,
  page: () => Promise<ReactNode>,
  pathname?: string,
): Promise<string> {
  return renderWithRouter(await asRequestOf(user, page), pathname);
}
