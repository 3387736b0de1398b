import "@fontsource/lato/400.css";
import "@fontsource/lato/700.css";
import "@fontsource/lato/900.css";
import "./globals.css";
import type { Metadata, Viewport } from "next";
import { connection } from "next/server";
import type { ReactNode } from "react";
import { Providers } from "@/components/providers";

export const metadata: Metadata = {
  title: { default: "Loopshift", template: "%s · Loopshift" },
  description: "Model, price and approve closed-loop retrofits of stepper axes.",
  icons: { icon: "/icon.svg" },
};

export const viewport: Viewport = { themeColor: "#123433" };

// Every page renders per request: the script nonce of proxy.ts's CSP is new each time, and a page
// prerendered at build time would carry scripts without it, which the browser would refuse.
export default async function RootLayout({ children }: { children: ReactNode }) {
  await connection();
  return (
    <html lang="en">
      <body className="min-h-screen">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
