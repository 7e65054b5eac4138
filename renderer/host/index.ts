/** Picks the host: Electron's preload bridge when present, else the browser preview's own. */
import type { HostClient } from './host-client';
import { createBrowserHost } from './browser-host';
import { createElectronHost } from './electron-host';

export { HostCallError } from './host-client';
export type { HostClient } from './host-client';

let client: HostClient | undefined;

/** The app's host client (created on first use). */
export function host(): HostClient {
  if (!client) client = window.droopline?.host ? createElectronHost(window.droopline.host) : createBrowserHost(window);
  return client;
}

/** Replaces the client (tests). */
export function setHostClient(c: HostClient | undefined): void {
  client = c;
}
