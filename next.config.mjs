/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // Built once by `npm start`; the build folder stays out of the way of the test build.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  serverExternalPackages: ["pg", "pg-boss", "sharp", "@react-pdf/renderer", "nodemailer"],
  // An upload that passes through proxy.ts (only when it carries forwarding headers) is buffered up to
  // this and cut after it: above the 10 MB photo limit plus form overhead, so the handler can say 413.
  experimental: { proxyClientMaxBodySize: "12mb" },
};

export default nextConfig;
