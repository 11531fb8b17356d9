import fs from 'node:fs';
import path from 'node:path';
import { readingPayloadJsonSchema } from '../shared/telemetry';

/**
 * Regenerates shared/telemetry.schema.json from the zod schema:
 * `npx tsx --tsconfig server/tsconfig.json broker/write-payload-schema.ts`.
 * spec/broker/payload-schema.spec.ts fails when the committed file is out of date.
 */
export const SCHEMA_FILE = path.join(__dirname, '..', 'shared', 'telemetry.schema.json');

export function payloadSchemaText(): string {
  return `${JSON.stringify(readingPayloadJsonSchema(), null, 2)}\n`;
}

if (require.main === module) {
  fs.writeFileSync(SCHEMA_FILE, payloadSchemaText());
  console.log(`wrote ${path.relative(process.cwd(), SCHEMA_FILE)}`);
}
