/**
 * Writes schema/gvf-model.schema.json from the zod schema (`npm run schema`). A test keeps the committed
 * file equal to `schemaText()`, so the published schema never drifts from what gvf accepts.
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { modelJsonSchema } from './schema.js';

/** The schema file's exact text. */
export function schemaText(): string {
  return `${JSON.stringify(modelJsonSchema(), null, 2)}\n`;
}

export const schemaPath = fileURLToPath(new URL('../../../schema/gvf-model.schema.json', import.meta.url));

if (process.argv[1] !== undefined && fileURLToPath(import.meta.url) === process.argv[1]) {
  writeFileSync(schemaPath, schemaText());
  process.stdout.write(`wrote ${schemaPath}\n`);
}
