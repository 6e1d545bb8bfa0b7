import pkg from '../../package.json' with { type: 'json' };

/** The stereogate version, from package.json. */
export const VERSION: string = (pkg as { version: string }).version;
