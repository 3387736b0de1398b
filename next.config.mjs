// Security headers for every response. The Content-Security-Policy is set per request by
// proxy.ts, with a fresh script nonce (no 'unsafe-inline' scripts), together with HSTS over https.

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
