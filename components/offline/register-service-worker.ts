/**
 * Registers the field-mode service worker (written into the web build by
 * server/scripts/field-mode-web.ts), so the app shell opens with no network.
 * Not in development (the dev server has no worker) nor where the browser
 * offers none.
 */
export function registerServiceWorker(): void {
  if (typeof navigator === 'undefined' || !('serviceWorker' in navigator)) return;
  if (process.env.NODE_ENV !== 'production') return;
  const register = () =>
    navigator.serviceWorker.register('/sw.js').catch((e: unknown) => {
      // The app works online without it; say why field mode is missing, for whoever looks.
      console.warn('[kenning] field mode unavailable: the service worker did not register', e);
    });
  if (document.readyState === 'complete') void register();
  else window.addEventListener('load', () => void register(), { once: true });
}
