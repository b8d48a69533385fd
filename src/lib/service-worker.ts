/**
 * Registers the service worker that the build generates (vite-plugin-pwa, see vite.config.ts): it precaches the app
 * shell so the booth card opens without a network. Registered once the page has loaded, so the worker's one-off
 * download of the shell never competes with the first screen. Not in the dev server (no worker is built there).
 */
export function registerServiceWorker() {
  if (import.meta.env.DEV || !("serviceWorker" in navigator)) return;
  const register = () => {
    navigator.serviceWorker.register("/sw.js", { scope: "/" }).catch(() => {
      // No worker (a private window, an old browser): the app works online as before.
    });
  };
  if (document.readyState === "complete") register();
  else window.addEventListener("load", register, { once: true });
}
