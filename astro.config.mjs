// Astro configuration: server output on Node, React islands, Tailwind, MDX and Auth.js.
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';
import mdx from '@astrojs/mdx';
import auth from 'auth-astro';
import { astroCsp } from './src/server/http/security-headers.ts';
import AstroPWA from '@vite-pwa/astro';
import * as offline from './src/lib/offline/cache-rules.mjs';

// @astrojs/node treats every request as coming from "localhost" unless the public hosts are listed,
// which breaks Astro's origin check for real form posts. PUBLIC_ORIGIN names the site's address.
const publicOrigin = new URL(process.env.PUBLIC_ORIGIN ?? 'http://127.0.0.1:4321');

export default defineConfig({
  output: 'server',
  // Middleware mode: the adapter's handler renders; our server entry (scripts/serve.ts) listens and answers the built
  // files from memory, compressed. Prerendered pages get their Content-Security-Policy as a header too (a <meta>
  // policy cannot hold frame-ancestors), read by the entry from the file the adapter writes.
  adapter: node({ mode: 'middleware', experimentalStaticHeaders: true }),
  integrations: [react(), tailwind({ applyBaseStyles: false }), mdx(), auth(), AstroPWA(pwaOptions())],
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
  // Stylesheets stay linked, not inlined (Astro's default): inlined, every page would carry the sheet again instead
  // of the reader's browser reading it from its cache; linked, it is served compressed (Brotli, made at build time).
  // A strict Content-Security-Policy: each page's header lists the hashes of its own inline scripts and styles
  // (src/server/http/security-headers.ts holds the directives).
  experimental: { csp: astroCsp },
  vite: {
    resolve: { dedupe: ['prosemirror-model', 'prosemirror-state', 'prosemirror-view', 'prosemirror-transform'] },
    ssr: { external: ['sharp', 'pg', 'knex', '@node-rs/argon2', 'pg-boss'] },
  },
});

// The installable web app: manifest and service worker (see DEVELOPERS.md, "At the bench, offline"). With server
// output the plugin's default would cache no page: pages are cached at run time, network first, by the rules in
// src/lib/offline/cache-rules.mjs. src/scripts/offline/register.ts registers the worker (no script is injected).
function pwaOptions() {
  const { cacheNames, cacheBounds } = offline;
  return {
    injectRegister: null,
    registerType: 'autoUpdate',
    includeAssets: ['favicon.svg', 'icons/*.png'],
    manifest: {
      name: 'Benchlore',
      short_name: 'Benchlore',
      description: 'Faults and fixes for tape and disc recorders and players, readable at the bench.',
      lang: 'en',
      start_url: '/',
      scope: '/',
      display: 'standalone',
      theme_color: '#0f4c4a',
      background_color: '#f6f1e7',
      icons: [
        { src: '/icons/benchlore-192.png', sizes: '192x192', type: 'image/png' },
        { src: '/icons/benchlore-512.png', sizes: '512x512', type: 'image/png' },
        { src: '/icons/benchlore-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
      ],
    },
    workbox: {
      navigateFallback: null,
      // The offline and kept pages (prerendered) with the styles, fonts and small scripts they need; the rest is
      // cached as used. The big islands (the editor, charts) are never stored ahead.
      globPatterns: [
        'offline/index.html',
        'kept/index.html',
        'manifest.webmanifest',
        '_astro/*.css',
        '_astro/*-latin-{400,600,700}-*.woff2',
        '_astro/{BaseLayout,offline,kept}.astro_astro_type_script_*.js',
        '_astro/{preload-helper,outbox-store,outbox,keep,cache-rules,sign-out,bench-view}.*.js',
      ],
      cleanupOutdatedCaches: true,
      clientsClaim: true,
      skipWaiting: true,
      runtimeCaching: [
        { urlPattern: offline.isSignOut, method: 'POST', handler: offline.signOutHandler },
        {
          urlPattern: offline.isPrivateNavigation,
          handler: 'NetworkOnly',
          options: { precacheFallback: { fallbackURL: '/offline' } },
        },
        {
          urlPattern: offline.isNavigation,
          handler: 'NetworkFirst',
          options: {
            cacheName: cacheNames.pages,
            networkTimeoutSeconds: 3,
            expiration: cacheBounds.pages,
            cacheableResponse: offline.onlyOk,
            plugins: [offline.keptOrOffline, offline.markSavedCopy],
          },
        },
        {
          urlPattern: offline.isPhoto,
          handler: 'CacheFirst',
          options: {
            cacheName: cacheNames.photos,
            expiration: cacheBounds.photos,
            cacheableResponse: offline.onlyOk,
            plugins: [offline.keptOrOffline],
          },
        },
        {
          urlPattern: offline.isSiteFile,
          handler: 'CacheFirst',
          options: { cacheName: cacheNames.assets, expiration: cacheBounds.assets, cacheableResponse: offline.onlyOk },
        },
      ],
    },
  };
}
