// Module hooks for recordLoads.mjs: every module loaded is appended to the file given.
import { appendFileSync } from 'node:fs';

let file;

export function initialize(data) {
  file = data.file;
}

export async function load(url, context, nextLoad) {
  if (file) appendFileSync(file, url + '\n');
  return nextLoad(url, context);
}
