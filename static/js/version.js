/**
 * The one version source of the front end. The service worker names its cache after it:
 * bump it whenever a file of the app shell changes, so that phones pick up the update.
 */
export const VERSION = "1.1.3";
