// Next.js configuration. Kept small: the app runs on one machine with its own PostgreSQL.
/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  reactStrictMode: true,
  // fonts/ is read at run time by the PDF renderer.
  outputFileTracingIncludes: { "/api/**": ["./fonts/**"] },
};
export default nextConfig;
