/// <reference types="vite-plugin-pwa/client" />
// Registers the service worker that keeps the app shell on the phone (vite.config.ts: offlineAppShell). A new
// version installs in the background and takes over on the next load; nobody is asked to press "reload".
import { registerSW } from 'virtual:pwa-register';

export function registerServiceWorker(): void {
  // Development serves modules from Vite, not a built shell: nothing to precache there.
  if (import.meta.env.DEV || !('serviceWorker' in navigator)) return;
  void registerSW({ immediate: true });
}
