// The fixed security headers of lib/http/security.ts (SECURITY_HEADERS), for the build's static files that
// proxy.ts does not see; a unit test keeps the two lists equal.
const SECURITY_HEADERS = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  {
    key: "Permissions-Policy",
    value: "accelerometer=(), camera=(), geolocation=(), gyroscope=(), magnetometer=(), microphone=(), payment=(), usb=(), browsing-topics=()",
  },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
];

/** @type {import('next').NextConfig} */
const nextConfig = {
  async headers() {
    return [
      { source: "/_next/static/:path*", headers: SECURITY_HEADERS },
      { source: "/_next/image", headers: SECURITY_HEADERS },
      { source: "/favicon.ico", headers: SECURITY_HEADERS },
    ];
  },
  // A separate build folder lets the test run build beside a developer's own build.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  poweredByHeader: false,
  serverExternalPackages: ["exceljs", "psychrolib", "nodemailer", "smtp-server", "mailparser", "pg-boss"],
  typedRoutes: false,
  experimental: {
    serverActions: { bodySizeLimit: "1mb" },
    authInterrupts: true,
  },
};

export default nextConfig;
