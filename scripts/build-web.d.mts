/** Builds the web page (app.js, app.css, index.html) into outdir (default server/public); returns the folder. */
export function buildWeb(options?: { outdir?: string; minify?: boolean }): Promise<string>;
