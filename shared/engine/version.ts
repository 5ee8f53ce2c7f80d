/** Recorded with every run, so results can be traced to the code that produced them. */
export const ENGINE_VERSION = '0.1.0';
