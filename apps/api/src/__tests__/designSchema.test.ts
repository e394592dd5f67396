import {
  analyseDesign,
  BRIDGE_SCHEMES,
  CARRIER_SAMPLINGS,
  DAMPING_PLACEMENTS,
  DESIGN_BOUNDS,
  MAX_DESIGN_FREQUENCY_RATIO,
  MAX_PATTERN_ANGLES,
  MODULATION_METHODS,
  MULTILEVEL_CARRIER_ARRANGEMENTS,
  MULTILEVEL_LEVEL_BOUNDS,
  MULTILEVEL_TOPOLOGIES,
  MULTILEVEL_ZERO_SEQUENCES,
  OVERMODULATION_METHODS,
  SHE_KINDS,
  SPACE_VECTOR_SEQUENCES,
  ZERO_SEQUENCES,
  ZERO_VECTOR_CLAMPINGS,
  type InverterDesign,
  type NumberBounds,
} from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { loadOpenApiDocument, resolveRef, type JsonSchema } from '../openapi.js';

/**
 * The OpenAPI document restates the library's design bounds and option lists (a schema cannot
 * import them); these tests compare every one, so the two cannot drift apart unnoticed.
 */
const document = loadOpenApiDocument();
const schemas = document.components.schemas;
const resolve = (schema: JsonSchema | undefined): JsonSchema => resolveRef(document, schema) ?? {};

interface Bounds {
  min: number | undefined;
  max: number | undefined;
  minExclusive: boolean;
  maxExclusive: boolean;
  integer: boolean;
}

const fromLibrary = (b: NumberBounds): Bounds => ({
  min: b.min,
  max: b.max,
  minExclusive: b.minExclusive === true,
  maxExclusive: b.maxExclusive === true,
  integer: b.integer === true,
});

const fromSchema = (s: JsonSchema): Bounds => ({
  min: (s.exclusiveMinimum ?? s.minimum) as number | undefined,
  max: (s.exclusiveMaximum ?? s.maximum) as number | undefined,
  minExclusive: typeof s.exclusiveMinimum === 'number',
  maxExclusive: typeof s.exclusiveMaximum === 'number',
  integer: s.type === 'integer',
});

/** Every numeric leaf under `schema`, by its dotted path (an array's items take the array's path). */
function numericLeaves(
  schema: JsonSchema | undefined,
  path: string,
  out = new Map<string, JsonSchema[]>(),
): Map<string, JsonSchema[]> {
  const node = resolve(schema);
  const branches = (node.oneOf ?? node.anyOf) as JsonSchema[] | undefined;
  if (Array.isArray(branches)) {
    for (const branch of branches) numericLeaves(branch, path, out);
    return out;
  }
  const type = Array.isArray(node.type) ? (node.type as string[]) : [node.type as string];
  if (type.includes('number') || type.includes('integer'))
    out.set(path, [...(out.get(path) ?? []), node]);
  if (type.includes('array')) numericLeaves(node.items as JsonSchema, path, out);
  for (const [key, child] of Object.entries(
    (node.properties as Record<string, JsonSchema> | undefined) ?? {},
  )) {
    numericLeaves(child, path ? `${path}.${key}` : key, out);
  }
  return out;
}

describe('the OpenAPI design schemas agree with the library', () => {
  it('every numeric field of InverterDesign has exactly the bounds of DESIGN_BOUNDS, and every bound has a field', () => {
    // The device's bounds are LOSS_DEVICE_BOUNDS, compared in lossDeviceSchema.test.ts.
    const leaves = new Map(
      [...numericLeaves(schemas.InverterDesign, '')].filter(
        ([path]) => !path.startsWith('device.'),
      ),
    );
    const libraryPaths = Object.keys(DESIGN_BOUNDS).sort();
    expect([...leaves.keys()].sort()).toEqual(libraryPaths);
    for (const [path, nodes] of leaves) {
      const expected = fromLibrary(DESIGN_BOUNDS[path as keyof typeof DESIGN_BOUNDS]);
      for (const node of nodes) expect(fromSchema(node), path).toEqual(expected);
    }
  });

  it('the full Modulation schemas (for /spectra, /waveforms and sweeps) use the same bounds, with mf ≤ MAX_DESIGN_FREQUENCY_RATIO', () => {
    const leaves = numericLeaves(schemas.Modulation, 'modulation');
    for (const [path, nodes] of leaves) {
      for (const node of nodes) {
        if (path === 'modulation.vdc')
          expect(fromSchema(node), path).toEqual(fromLibrary(DESIGN_BOUNDS.vdc));
        else if (path === 'modulation.mf' || path === 'modulation.frequencyRatio') {
          expect(fromSchema(node), path).toEqual(
            fromLibrary({ min: 1, max: MAX_DESIGN_FREQUENCY_RATIO, integer: true }),
          );
        } else
          expect(fromSchema(node), path).toEqual(
            fromLibrary(DESIGN_BOUNDS[path as keyof typeof DESIGN_BOUNDS]),
          );
      }
    }
    expect([...leaves.keys()]).toEqual(
      expect.arrayContaining(['modulation.vdc', 'modulation.mf', 'modulation.frequencyRatio']),
    );
  });

  it('a stored pattern holds at most MAX_PATTERN_ANGLES angles', () => {
    expect(resolve(schemas.PatternAngles).maxItems).toBe(MAX_PATTERN_ANGLES);
  });

  it('the option lists are the library’s, in its order', () => {
    const enumOf = (name: string): unknown => resolve(schemas[name]).enum;
    expect(enumOf('ModulationMethod')).toEqual(MODULATION_METHODS);
    expect(enumOf('BridgeScheme')).toEqual(BRIDGE_SCHEMES);
    expect(enumOf('CarrierSampling')).toEqual(CARRIER_SAMPLINGS);
    expect(enumOf('ZeroSequence')).toEqual(ZERO_SEQUENCES);
    expect(enumOf('SpaceVectorSequence')).toEqual(SPACE_VECTOR_SEQUENCES);
    expect(enumOf('ZeroVectorClamping')).toEqual(ZERO_VECTOR_CLAMPINGS);
    expect(enumOf('OvermodulationMethod')).toEqual(OVERMODULATION_METHODS);
    expect(enumOf('SheKind')).toEqual(SHE_KINDS);
    expect(enumOf('MultilevelTopology')).toEqual(MULTILEVEL_TOPOLOGIES);
    expect(enumOf('MultilevelCarrierArrangement')).toEqual(MULTILEVEL_CARRIER_ARRANGEMENTS);
    expect(enumOf('MultilevelZeroSequence')).toEqual(MULTILEVEL_ZERO_SEQUENCES);
    expect(enumOf('PhaseCount')).toEqual([1, 3]);
    // The schema's levels span every topology's own range (the library names the topology's).
    const levels = fromSchema(resolve(schemas.MultilevelLevels));
    expect(levels.min).toBe(Math.min(...Object.values(MULTILEVEL_LEVEL_BOUNDS).map((b) => b.min)));
    expect(levels.max).toBe(Math.max(...Object.values(MULTILEVEL_LEVEL_BOUNDS).map((b) => b.max)));
    expect(
      (resolve(schemas.DesignFilter).properties as Record<string, JsonSchema>).dampingPlacement
        ?.enum,
    ).toEqual(DAMPING_PLACEMENTS);
    // One branch per method in both unions, each tagged with its method.
    for (const union of ['Modulation', 'DesignModulation']) {
      const tags = (resolve(schemas[union]).oneOf as JsonSchema[]).map(
        (b) => (resolve(b).properties as Record<string, JsonSchema>).method?.const,
      );
      expect(tags, union).toEqual(MODULATION_METHODS);
    }
  });

  it('the report options have the ranges analyseDesign accepts (checked at each end)', () => {
    const design: InverterDesign = {
      vdc: 100,
      fundamentalFrequency: 50,
      carrierFrequency: 350,
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
    };
    const option = (name: string): Bounds => fromSchema(resolve(schemas[name]));
    const cases: [keyof NonNullable<Parameters<typeof analyseDesign>[1]>, Bounds, number][] = [
      ['maxOrder', option('ReportMaxOrder'), 1],
      ['points', option('ReportPoints'), 1],
      ['busVoltage', option('BusVoltage'), 0],
    ];
    for (const [name, bounds, step] of cases) {
      const at = (value: number) => () => analyseDesign(design, { [name]: value });
      const { min, max } = bounds as { min: number; max: number };
      if (bounds.minExclusive) expect(at(min), `${name} = ${min}`).toThrow(name);
      else {
        expect(at(min), `${name} = ${min}`).not.toThrow();
        expect(at(min - step), `${name} = ${min - step}`).toThrow(name);
      }
      expect(at(max), `${name} = ${max}`).not.toThrow();
      expect(at(max + Math.max(step, max * 1e-9)), `${name} above ${max}`).toThrow(name);
      if (bounds.integer) expect(at(min + 0.5), `${name} = ${min + 0.5}`).toThrow(name);
    }
  });
});
