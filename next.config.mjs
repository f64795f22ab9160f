/** @type {import('next').NextConfig} */
const nextConfig = {
  // Server-only packages that must not be bundled (they load drivers and files at run time).
  serverExternalPackages: ['@mikro-orm/postgresql', '@mikro-orm/migrations', 'knex', 'pg-boss', 'smtp-server', 'mailparser'],
  poweredByHeader: false,
  reactStrictMode: true,
};

export default nextConfig;
