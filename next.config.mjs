/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect at run time; bundling it breaks that (the build passes, then "Please install pg package manually").
  serverExternalPackages: [
    'sequelize',
    'pg',
    'pg-hstore',
    'bwip-js',
    'pdf-lib',
    '@pdf-lib/fontkit',
    'nodemailer',
    'stripe',
  ],
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
    // Sequelize names each model (and its SQL alias) after its class; minified server code gives
    // different models the same short class name, and an include then joins the wrong table
    // ("column kind.name does not exist": treatments joined to treatments). Client code stays minified.
    turbopackMinify: { server: false, client: true },
  },
};

export default nextConfig;
