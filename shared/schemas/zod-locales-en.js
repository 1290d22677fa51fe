// The web bundle's stand-in for zod's `locales` namespace (see metro.config.js):
// English only. Zod configures English itself; the app never reads `z.locales`.
export { default as en } from 'zod/v4/locales/en.js';
