// Astro configuration: server output on Node, React islands, Tailwind, MDX and Auth.js.
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';
import mdx from '@astrojs/mdx';
import auth from 'auth-astro';

// @astrojs/node treats every request as coming from "localhost" unless the public hosts are listed,
// which breaks Astro's origin check for real form posts. PUBLIC_ORIGIN names the site's address.
const publicOrigin = new URL(process.env.PUBLIC_ORIGIN ?? 'http://127.0.0.1:4321');

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), tailwind({ applyBaseStyles: false }), mdx(), auth()],
  security: {
    // The same check runs in our route guard (src/server/http/route-guard.ts), where the route table can let
    // one-click unsubscribe (RFC 8058) take posts from mail programs.
    checkOrigin: false,
    allowedDomains: [
      // No port: the same build serves `npm start`, the test servers and any PORT chosen at run time.
      { protocol: publicOrigin.protocol.replace(':', ''), hostname: publicOrigin.hostname },
    ],
  },
  server: { host: '127.0.0.1', port: 4321 },
  vite: {
    resolve: { dedupe: ['prosemirror-model', 'prosemirror-state', 'prosemirror-view', 'prosemirror-transform'] },
    ssr: { external: ['sharp', 'pg', 'knex', '@node-rs/argon2', 'pg-boss'] },
  },
});
