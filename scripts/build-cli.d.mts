/** Bundles the CLI (main.js, batch-worker.js and their chunks) into outdir (default dist/cli); returns the folder. */
export function buildCli(options?: { outdir?: string }): Promise<string>;
export const EXTERNAL_PACKAGES: string[];
