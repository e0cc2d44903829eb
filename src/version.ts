/** tandem's version, written into plan files and reports. Keep in step with package.json. */
export const VERSION = '0.1.0';
