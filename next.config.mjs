/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect at run time; bundling it breaks that (STACK.md §5).
  serverExternalPackages: ['sequelize', 'pg', 'pg-hstore', 'bwip-js', 'pdf-lib', '@pdf-lib/fontkit', 'nodemailer', 'stripe'],
  poweredByHeader: false,
  typedRoutes: false,
  experimental: {
    serverActions: { bodySizeLimit: '12mb' },
  },
};

export default nextConfig;
