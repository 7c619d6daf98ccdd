// The app version stored with every design revision, so a result can be traced to the code that made it.
export const APP_VERSION = '0.1.0';
