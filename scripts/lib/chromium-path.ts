/** Debian's Chromium: the browser tests and screenshots drive it; nothing downloads a browser here. */
export const CHROMIUM_PATH = '/usr/bin/chromium';
