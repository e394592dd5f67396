import { LOSS_DEVICE_BOUNDS, type NumberBounds } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { loadOpenApiDocument, resolveRef, type JsonSchema } from '../openapi.js';

/**
 * The OpenAPI schema SemiconductorDevice restates the library's device bounds (a schema cannot
 * import them); this test compares every field of both device kinds, so they cannot drift apart.
 */
const document = loadOpenApiDocument();
const device = resolveRef(document, document.components.schemas.SemiconductorDevice) ?? {};
const branches = ((device.oneOf ?? []) as JsonSchema[]).map((b) => resolveRef(document, b) ?? {});

interface Bounds {
  min: number | undefined;
  max: number | undefined;
  minExclusive: boolean;
  maxExclusive: boolean;
}

const fromLibrary = (b: Readonly<NumberBounds>): Bounds => ({
  min: b.min,
  max: b.max,
  minExclusive: b.minExclusive === true,
  maxExclusive: b.maxExclusive === true,
});

const fromSchema = (s: JsonSchema): Bounds => ({
  min: (s.exclusiveMinimum ?? s.minimum) as number | undefined,
  max: (s.exclusiveMaximum ?? s.maximum) as number | undefined,
  minExclusive: typeof s.exclusiveMinimum === 'number',
  maxExclusive: typeof s.exclusiveMaximum === 'number',
});

describe('the OpenAPI SemiconductorDevice schema agrees with the library', () => {
  it('has an IGBT and a MOSFET branch', () => {
    const kinds = branches.map(
      (b) => ((b.properties as Record<string, JsonSchema>).kind as JsonSchema).const,
    );
    expect(kinds.sort()).toEqual(['igbt', 'mosfet']);
  });

  it('every numeric field of each device kind has exactly the bounds of LOSS_DEVICE_BOUNDS', () => {
    const seen = new Set<string>();
    for (const branch of branches) {
      for (const [field, schema] of Object.entries(
        branch.properties as Record<string, JsonSchema>,
      )) {
        if (schema.type !== 'number') continue;
        seen.add(field);
        const library = LOSS_DEVICE_BOUNDS[field as keyof typeof LOSS_DEVICE_BOUNDS];
        expect(library, `device.${field} has library bounds`).toBeDefined();
        expect(fromSchema(schema), `device.${field}`).toEqual(fromLibrary(library));
      }
    }
    expect([...seen].sort()).toEqual(Object.keys(LOSS_DEVICE_BOUNDS).sort());
  });
});
