/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect at run time; bundling it breaks that (STACK.md §5).
  serverExternalPackages: ['sequelize', 'pg', 'pg-hstore', 'bwip-js', 'pdf-lib', '@pdf-lib/fontkit', 'nodemailer', 'stripe'],
  poweredByHeader: false,
  typedRoutes: false,
  // ASVS 3.4: safe defaults on every answer; pages also get a nonce-based CSP from proxy.ts.
  async headers() {
    const common = [
      { key: 'X-Content-Type-Options', value: 'nosniff' },
      { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
      { key: 'Permissions-Policy', value: 'camera=(self), microphone=(), geolocation=()' },
    ];
    return [
      { source: '/:path*', headers: common },
      { source: '/((?!api/).*)', headers: [{ key: 'X-Frame-Options', value: 'DENY' }] },
    ];
  },
  experimental: {
    serverActions: { bodySizeLimit: '12mb' },
  },
};

export default nextConfig;
