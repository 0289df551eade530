/** Tool version, printed by --version and written into reports. Keep in step with package.json. */
export const VERSION = '0.1.0';
