import packageJson from '../package.json';

/** The release the server reports, from package.json. */
export const appVersion: string = packageJson.version;
