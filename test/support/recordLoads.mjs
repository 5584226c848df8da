// `node --import ./test/support/recordLoads.mjs`: writes the URL of every module the process
// loads, one a line, to the file named by TILEFLUX_LOADS_FILE (for the test of what a command's
// --help loads). The hooks run on the loader thread, so they append to the file themselves.
import { register } from 'node:module';

register(new URL('./recordLoadsHooks.mjs', import.meta.url), {
  data: { file: process.env.TILEFLUX_LOADS_FILE },
});
