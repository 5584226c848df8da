/**
 * What `tileflux init` does (registered in cli/commands/init.ts): the commented starter field
 * file, or the JSON Schema of field files.
 */
import { z } from 'zod';
import { fieldSchema } from '../../scenarios/fieldSchema.js';
import { starterFieldFile } from '../../scenarios/starter.js';
import { writeFileAtomic } from '../../io/atomicOutput.js';

/** Write the starter file to `file` (stdout without one), or print the schema with --json. */
export function init(file: string | undefined, o: { force?: boolean; json?: boolean }): void {
  if (o.json) {
    const schema = z.toJSONSchema(fieldSchema, { io: 'input', unrepresentable: 'any' });
    process.stdout.write(JSON.stringify(schema, null, 2) + '\n');
    return;
  }
  const text = starterFieldFile();
  if (!file) {
    process.stdout.write(text);
    return;
  }
  writeFileAtomic(file, text, Boolean(o.force));
  process.stderr.write(
    `Wrote ${file}; edit it, then: tileflux run ${file} --weather WEATHER.csv\n`,
  );
}
