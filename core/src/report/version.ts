import corePackage from '../../package.json';

export const TOOL_NAME = 'Linewright';
/** The core package's version: one place to bump, read by every report and `--version`. */
export const TOOL_VERSION: string = corePackage.version;
