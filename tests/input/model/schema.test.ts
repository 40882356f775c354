/**
 * The published JSON Schema (schema/gvf-model.schema.json) is generated from the zod schema; it must not
 * drift from what gvf accepts. Run `npm run schema` after changing src/input/model/schema.ts.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { schemaPath, schemaText } from '../../../src/input/model/writeSchema.js';

describe('schemaText()', () => {
  it('schemaText() equals the committed schema/gvf-model.schema.json (run `npm run schema` when it does not)', () => {
    expect(readFileSync(schemaPath, 'utf8')).toBe(schemaText());
  });

  it('schemaText() closes every object to unknown keys and requires the core keys', () => {
    const schema = JSON.parse(schemaText()) as Record<string, any>;
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(schema.additionalProperties).toBe(false);
    expect(schema.required).toEqual(['units', 'sections', 'reaches', 'flows']);
    const shapes = schema.properties.sections.additionalProperties.oneOf as Array<Record<string, any>>;
    expect(shapes.map((s) => s.properties.shape.const)).toEqual(['rectangular', 'trapezoidal', 'triangular', 'circular', 'points']);
    for (const shape of shapes) expect(shape.additionalProperties).toBe(false);
    // a reach is prismatic or surveyed: each kind is closed
    const reachKinds = schema.properties.reaches.items.anyOf as Array<Record<string, any>>;
    expect(reachKinds).toHaveLength(2);
    for (const kind of reachKinds) expect(kind.additionalProperties).toBe(false);
    expect(schema.properties.method.default).toBe('standard-step');
  });
});
