/** Types of scripts/build-cli.mjs for the TypeScript that imports it (test/globalSetup.ts). */
export declare const CLI_OUT_DIR: string;
export declare const CLI_ENTRY: string;
export declare function buildCli(): Promise<string>;
