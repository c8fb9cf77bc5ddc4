// Astro configuration: server output on Node, React islands, Tailwind, MDX and Auth.js.
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';
import mdx from '@astrojs/mdx';
import auth from 'auth-astro';
import { astroCsp } from './src/server/http/security-headers.ts';

// @astrojs/node treats every request as coming from "localhost" unless the public hosts are listed,
// which breaks Astro's origin check for real form posts. PUBLIC_ORIGIN names the site's address.
const publicOrigin = new URL(process.env.PUBLIC_ORIGIN ?? 'http://127.0.0.1:4321');

export default defineConfig({
  output: 'server',
  // Prerendered pages get their Content-Security-Policy as a header too (a <meta> policy cannot hold frame-ancestors).
  adapter: node({ mode: 'standalone', experimentalStaticHeaders: true }),
  integrations: [react(), tailwind({ applyBaseStyles: false }), mdx(), auth()],
  security: {
    // Astro's origin check runs from src/middleware.ts instead (src/server/http/origin-check.ts), so that its 403
    // answers carry the security headers; Astro would run it before any middleware of ours.
    checkOrigin: false,
    allowedDomains: [
      // No port: the same build serves `npm start`, the test servers and any PORT chosen at run time.
      { protocol: publicOrigin.protocol.replace(':', ''), hostname: publicOrigin.hostname },
    ],
  },
  server: { host: '127.0.0.1', port: 4321 },
  // A strict Content-Security-Policy: each page's header lists the hashes of its own inline scripts and styles
  // (src/server/http/security-headers.ts holds the directives).
  experimental: { csp: astroCsp },
  vite: {
    resolve: { dedupe: ['prosemirror-model', 'prosemirror-state', 'prosemirror-view', 'prosemirror-transform'] },
    ssr: { external: ['sharp', 'pg', 'knex', '@node-rs/argon2', 'pg-boss'] },
  },
});
