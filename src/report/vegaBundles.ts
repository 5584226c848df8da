/**
 * Node-side loader of the browser builds of vega, vega-lite and vega-embed that the HTML report
 * inlines (so that it opens offline). Kept apart from the HTML builder, which stays a pure
 * function of its inputs.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

/** Source text of the three browser scripts, in load order. */
export interface VegaBundles {
  vega: string;
  vegaLite: string;
  vegaEmbed: string;
}

let cached: VegaBundles | undefined;

/** Read a package's minified browser build from the folder of its resolved entry point. */
function readBuild(require: NodeJS.Require, pkg: string, file: string): string {
  // The packages' export maps hide build/*.min.js; their main entries live in the same folder.
  return readFileSync(join(dirname(require.resolve(pkg)), file), 'utf8');
}

/**
 * The minified UMD builds from node_modules (vega/build/vega.min.js,
 * vega-lite/build/vega-lite.min.js, vega-embed/build/vega-embed.min.js), read once.
 *
 * @example loadVegaBundles().vega.length // about 520 000
 */
export function loadVegaBundles(): VegaBundles {
  if (!cached) {
    const require = createRequire(import.meta.url);
    cached = {
      vega: readBuild(require, 'vega', 'vega.min.js'),
      vegaLite: readBuild(require, 'vega-lite', 'vega-lite.min.js'),
      vegaEmbed: readBuild(require, 'vega-embed', 'vega-embed.min.js'),
    };
  }
  return cached;
}
