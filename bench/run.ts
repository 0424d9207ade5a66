// Runs every bench/*.bench.ts in turn. Each module exports `run(): Promise<void> | void`
// and prints its own figures. No thresholds here: speed goals are read, not asserted.
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv[2];
const files = readdirSync(here)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => !only || f.includes(only))
  .sort();

for (const file of files) {
  console.log(`\n== ${file.replace('.bench.ts', '')} ==`);
  const mod = (await import(pathToFileURL(join(here, file)).href)) as { run: () => Promise<void> | void };
  await mod.run();
}
