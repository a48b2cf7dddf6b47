/** @type {import('next').NextConfig} */
const nextConfig = {
  serverExternalPackages: [
    "sequelize",
    "pg",
    "pg-hstore",
    "pg-boss",
    "bcryptjs",
    "nodemailer",
    "umzug",
    "sharp",
    "pdfkit",
    "stripe",
  ],
  poweredByHeader: false,
  reactStrictMode: true,
  typedRoutes: false,
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "same-origin" },
          { key: "X-Frame-Options", value: "DENY" },
        ],
      },
    ];
  },
};

export default nextConfig;
