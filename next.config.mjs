// Security headers for every response. Next.js injects small inline bootstrap scripts, so the
// production CSP allows 'unsafe-inline' scripts but never 'unsafe-eval'; the dev server needs eval
// for fast refresh, so that is added in development only.
const isDev = process.env.NODE_ENV !== "production";

const contentSecurityPolicy = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${isDev ? " 'unsafe-eval'" : ""}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join("; ");

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // The proxy buffers request bodies up to this size; the evaluate API accepts cases up to 20 MB
  // (imports stop at 10 MB), so the buffer must hold a little more than that.
  experimental: { proxyClientMaxBodySize: "21mb" },
  // Native and server-only packages stay out of the bundle and load from node_modules.
  serverExternalPackages: ["better-sqlite3", "exceljs", "nodemailer", "smtp-server", "stripe"],
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "Content-Security-Policy", value: contentSecurityPolicy },
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
          { key: "X-Frame-Options", value: "DENY" },
          { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=()" },
        ],
      },
    ];
  },
};

export default nextConfig;
