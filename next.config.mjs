/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // Built once by `npm start`; the build folder stays out of the way of the test build.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  serverExternalPackages: ["pg", "pg-boss", "sharp", "@react-pdf/renderer", "nodemailer"],
};

export default nextConfig;
