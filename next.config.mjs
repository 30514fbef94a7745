/** @type {import('next').NextConfig} */
const nextConfig = {
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
