import fc from 'fast-check';

/** A JSON Schema node of the OpenAPI document. */
export type Schema = Record<string, unknown>;

/** The parts of the OpenAPI document the fuzzer reads. */
export interface Document {
  paths: Record<string, Record<string, unknown>>;
  components: Record<string, unknown>;
}

/** Strings that have broken services before: bidi overrides, NUL, emoji, surrogates, markup. */
const AWKWARD_STRINGS = [
  'Ω≈ç√∫ ÅÍÎÏ',
  '\u202eevil\u202c.csv',
  'a\u0000b',
  '💥🔥'.repeat(8),
  'e\u0301\u0301\u0301',
  '\u200b\u200d\ufeff',
  '<script>alert(1)</script>',
  "'; DROP TABLE studies;--",
  '../../etc/passwd',
  '%00%2e%2e%2f',
  '=HYPERLINK("http://example.invalid")',
  '   ',
  '\n\r\t',
];

/** Code points from all planes except surrogate halves (JSON Schema counts code points). */
const anyCodePoint = fc
  .oneof(
    { weight: 3, arbitrary: fc.integer({ min: 0x20, max: 0x7e }) },
    { weight: 1, arbitrary: fc.integer({ min: 0xa0, max: 0xd7ff }) },
    { weight: 1, arbitrary: fc.integer({ min: 0xe000, max: 0x10ffff }) },
  )
  .map((cp) => String.fromCodePoint(cp));

const codePointLength = (s: string): number => [...s].length;

/** Resolves `$ref`s and merges `allOf` into one schema (properties merged recursively). */
export class SchemaTools {
  constructor(readonly document: Document) {}

  deref(schema: Schema | undefined): Schema {
    let current: Schema = schema ?? {};
    for (let depth = 0; typeof current.$ref === 'string' && depth < 20; depth++) {
      const pointer = current.$ref.replace(/^#\//, '').split('/');
      let target: unknown = this.document;
      for (const part of pointer) target = (target as Record<string, unknown> | undefined)?.[part];
      current = (target as Schema | undefined) ?? {};
    }
    return current;
  }

  /** `$ref` followed and `allOf` merged, so the node can be read directly. */
  resolve(schema: Schema | undefined): Schema {
    const node = this.deref(schema);
    if (!Array.isArray(node.allOf)) return node;
    let merged: Schema = { ...node };
    delete merged.allOf;
    for (const part of node.allOf as Schema[]) merged = this.merge(merged, this.resolve(part));
    return merged;
  }

  private merge(a: Schema, b: Schema): Schema {
    const result: Schema = { ...a, ...b };
    const pa = (a.properties ?? {}) as Record<string, Schema>;
    const pb = (b.properties ?? {}) as Record<string, Schema>;
    const properties: Record<string, Schema> = { ...pa };
    for (const [key, value] of Object.entries(pb)) {
      properties[key] = key in pa ? this.merge(this.resolve(pa[key]), this.resolve(value)) : value;
    }
    if (Object.keys(properties).length) result.properties = properties;
    const required = [
      ...new Set([...((a.required as string[]) ?? []), ...((b.required as string[]) ?? [])]),
    ];
    if (required.length) result.required = required;
    if (a.additionalProperties === false || b.additionalProperties === false)
      result.additionalProperties = false;
    return result;
  }

  /** The branches of a oneOf/anyOf, resolved. */
  branches(schema: Schema): Schema[] {
    const choices = (schema.oneOf ?? schema.anyOf) as Schema[] | undefined;
    return Array.isArray(choices) ? choices.map((c) => this.resolve(c)) : [];
  }

  /** The JSON types a schema admits ('integer' also admits nothing else; 'number' admits integers). */
  types(schema: Schema): Set<string> {
    const s = this.resolve(schema);
    const branches = this.branches(s);
    if (branches.length) return new Set(branches.flatMap((b) => [...this.types(b)]));
    if (s.const !== undefined) return new Set([jsonType(s.const)]);
    if (Array.isArray(s.enum)) return new Set((s.enum as unknown[]).map(jsonType));
    if (Array.isArray(s.type)) return new Set(s.type as string[]);
    if (typeof s.type === 'string') return new Set([s.type]);
    return new Set(['any']);
  }

  /** The branch of a oneOf that a given value is meant for (by discriminator tag or null-ness). */
  branchFor(schema: Schema, value: unknown): Schema | undefined {
    const branches = this.branches(schema);
    if (!branches.length) return undefined;
    if (value === null) return branches.find((b) => b.type === 'null');
    const tag = (schema.discriminator as { propertyName?: string } | undefined)?.propertyName;
    if (tag) {
      const given = (value as Record<string, unknown> | undefined)?.[tag];
      return branches.find(
        (b) => (b.properties as Record<string, Schema> | undefined)?.[tag]?.const === given,
      );
    }
    return branches.find((b) => b.type !== 'null');
  }
}

export function jsonType(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'array';
  if (typeof value === 'number') return Number.isInteger(value) ? 'integer' : 'number';
  return typeof value;
}

/** Valid values of a schema. Numbers lean towards the low end so compute routes stay cheap. */
export function validArbitrary(
  tools: SchemaTools,
  input: Schema | undefined,
  depth = 0,
): fc.Arbitrary<unknown> {
  const schema = tools.resolve(input);
  if (schema.const !== undefined) return fc.constant(schema.const);
  if (Array.isArray(schema.enum)) return fc.constantFrom(...(schema.enum as unknown[]));
  const branches = tools.branches(schema);
  if (branches.length) return fc.oneof(...branches.map((b) => validArbitrary(tools, b, depth)));
  const types = Array.isArray(schema.type)
    ? (schema.type as string[])
    : typeof schema.type === 'string'
      ? [schema.type]
      : [];
  if (types.length > 1)
    return fc.oneof(...types.map((t) => validArbitrary(tools, { ...schema, type: t }, depth)));
  switch (types[0]) {
    case 'null':
      return fc.constant(null);
    case 'boolean':
      return fc.boolean();
    case 'integer':
      return integerArbitrary(schema);
    case 'number':
      return numberArbitrary(schema);
    case 'string':
      return stringArbitrary(schema);
    case 'array': {
      const minLength = (schema.minItems as number | undefined) ?? 0;
      const maxLength = Math.min(
        (schema.maxItems as number | undefined) ?? 6,
        Math.max(minLength, 6),
      );
      return fc.array(validArbitrary(tools, schema.items as Schema, depth + 1), {
        minLength,
        maxLength,
      });
    }
    case 'object': {
      const properties = (schema.properties ?? {}) as Record<string, Schema>;
      const required = (schema.required as string[] | undefined) ?? [];
      const model: Record<string, fc.Arbitrary<unknown>> = {};
      for (const [key, value] of Object.entries(properties))
        model[key] = validArbitrary(tools, value, depth + 1);
      return fc.record(model, { requiredKeys: required.filter((k) => k in model) });
    }
    default:
      return depth > 3 ? fc.constant(null) : fc.jsonValue({ maxDepth: 2 });
  }
}

function bounds(schema: Schema): {
  min: number;
  max: number;
  minExcluded: boolean;
  maxExcluded: boolean;
} {
  const exclusiveMin =
    typeof schema.exclusiveMinimum === 'number' ? schema.exclusiveMinimum : undefined;
  const exclusiveMax =
    typeof schema.exclusiveMaximum === 'number' ? schema.exclusiveMaximum : undefined;
  const min = exclusiveMin ?? (schema.minimum as number | undefined) ?? -1e6;
  const max = exclusiveMax ?? (schema.maximum as number | undefined) ?? 1e6;
  return {
    min,
    max,
    minExcluded: exclusiveMin !== undefined,
    maxExcluded: exclusiveMax !== undefined,
  };
}

function integerArbitrary(schema: Schema): fc.Arbitrary<number> {
  const b = bounds(schema);
  const min = b.minExcluded ? Math.floor(b.min) + 1 : Math.ceil(b.min);
  const max = b.maxExcluded ? Math.ceil(b.max) - 1 : Math.floor(b.max);
  const low = Math.min(max, min + Math.max(3, Math.round((max - min) * 0.02)));
  return fc.oneof(
    { weight: 6, arbitrary: fc.integer({ min, max: low }) },
    { weight: 1, arbitrary: fc.integer({ min, max }) },
    { weight: 1, arbitrary: fc.constantFrom(min, max) },
  );
}

function numberArbitrary(schema: Schema): fc.Arbitrary<number> {
  const b = bounds(schema);
  const full = fc.double({
    min: b.min,
    max: b.max,
    minExcluded: b.minExcluded,
    maxExcluded: b.maxExcluded,
    noNaN: true,
    noDefaultInfinity: true,
  });
  const lowTop = b.min + (b.max - b.min) * 0.05;
  const low = fc.double({
    min: b.min,
    max: lowTop,
    minExcluded: b.minExcluded,
    noNaN: true,
    noDefaultInfinity: true,
  });
  const edges = [b.minExcluded ? null : b.min, b.maxExcluded ? null : b.max].filter(
    (v): v is number => v !== null,
  );
  return fc.oneof(
    { weight: 6, arbitrary: low },
    { weight: 2, arbitrary: full },
    ...(edges.length ? [{ weight: 1, arbitrary: fc.constantFrom(...edges) }] : []),
  );
}

function stringArbitrary(schema: Schema): fc.Arbitrary<string> {
  const minLength = (schema.minLength as number | undefined) ?? 0;
  const maxLength = (schema.maxLength as number | undefined) ?? 200;
  switch (schema.format) {
    case 'uuid':
      return fc.uuid();
    case 'email':
      return fc.emailAddress().filter((e) => e.length >= minLength && e.length <= maxLength);
    case 'date-time':
      return fc
        .date({ min: new Date('2000-01-01'), max: new Date('2100-01-01'), noInvalidDate: true })
        .map((d) => d.toISOString());
    case 'binary':
      return fc.string();
    default:
      break;
  }
  if (typeof schema.pattern === 'string') {
    return fc
      .stringMatching(new RegExp(schema.pattern))
      .filter((s) => s.length >= minLength && s.length <= maxLength);
  }
  const awkward = AWKWARD_STRINGS.filter(
    (s) => codePointLength(s) >= minLength && codePointLength(s) <= maxLength,
  );
  const upper = Math.min(maxLength, Math.max(minLength, 40));
  return fc.oneof(
    { weight: 4, arbitrary: fc.string({ unit: anyCodePoint, minLength, maxLength: upper }) },
    ...(awkward.length ? [{ weight: 1, arbitrary: fc.constantFrom(...awkward) }] : []),
    {
      weight: 1,
      arbitrary: fc.constant(maxLength).map((n) => 'ü'.repeat(n)),
    },
  );
}

/** One place inside a valid value, with the schema that governs it. */
export interface Site {
  path: (string | number)[];
  schema: Schema;
  value: unknown;
  present: boolean;
  /** The JSON types the declared schema admits when `schema` is the one branch of a union the
   * value is meant for (a nullable object's null is not a wrong type). */
  unionTypes?: Set<string>;
}

/** Every place inside `value` (and every absent optional property), walked beside its schema. */
export function sitesOf(
  tools: SchemaTools,
  input: Schema | undefined,
  value: unknown,
  path: (string | number)[] = [],
): Site[] {
  let schema = tools.resolve(input);
  const branch = tools.branchFor(schema, value);
  const unionTypes = branch ? tools.types(schema) : undefined;
  if (branch)
    schema = {
      ...branch,
      ...(schema.discriminator ? { discriminator: schema.discriminator } : {}),
    };
  const sites: Site[] = [{ path, schema, value, present: true, unionTypes }];
  if (value && typeof value === 'object' && !Array.isArray(value)) {
    const properties = (schema.properties ?? {}) as Record<string, Schema>;
    for (const [key, sub] of Object.entries(properties)) {
      if (key in value)
        sites.push(...sitesOf(tools, sub, (value as Record<string, unknown>)[key], [...path, key]));
      else
        sites.push({
          path: [...path, key],
          schema: tools.resolve(sub),
          value: undefined,
          present: false,
        });
    }
  } else if (Array.isArray(value) && schema.items) {
    value
      .slice(0, 3)
      .forEach((item, i) =>
        sites.push(...sitesOf(tools, schema.items as Schema, item, [...path, i])),
      );
  }
  return sites;
}

/** A mutation kind and whether the result is certainly outside the schema. */
export type MutationKind =
  | 'wrong-type'
  | 'out-of-range'
  | 'not-integer'
  | 'bad-enum'
  | 'too-long'
  | 'too-short'
  | 'bad-format'
  | 'bad-pattern'
  | 'huge-array'
  | 'deep-nesting'
  | 'unknown-property'
  | 'missing-required';

export interface Mutation {
  kind: MutationKind;
  /** Where the mutation is (dot path of property names and indices). */
  path: (string | number)[];
  /** A replacement value, or DELETE to remove the property. */
  replacement: unknown;
  /** Raw JSON text to splice in instead of `replacement` (deep nesting is too deep for JSON.stringify). */
  raw?: string;
}

export const DELETE = Symbol('delete');

/** The ways a site can be made invalid (every one is certainly outside the schema). */
export function mutationsFor(
  tools: SchemaTools,
  site: Site,
  parentRequired: readonly string[],
): Mutation[] {
  const { schema, path } = site;
  const out: Mutation[] = [];
  const last = path[path.length - 1];
  if (!site.present) {
    return [];
  }
  if (typeof last === 'string' && parentRequired.includes(last))
    out.push({ kind: 'missing-required', path, replacement: DELETE });
  const types = site.unionTypes ?? tools.types(schema);
  if (!types.has('any')) {
    const candidates: [string, unknown][] = [
      ['string', 'not a number ünïcødé'],
      ['number', 12345.678],
      ['boolean', true],
      ['object', { nested: { deeper: [1, 2, 3] } }],
      ['array', ['a', 1, null]],
      ['null', null],
    ];
    for (const [type, value] of candidates) {
      // 12345.678 is no integer, so it is a wrong type for integer-only fields as well.
      if (!types.has(type)) out.push({ kind: 'wrong-type', path, replacement: value });
    }
    if (!types.has('array')) {
      out.push({
        kind: 'huge-array',
        path,
        replacement: Array.from({ length: 100_000 }, (_, i) => i % 7),
      });
      out.push({
        kind: 'deep-nesting',
        path,
        replacement: null,
        raw: `${'['.repeat(20_000)}${']'.repeat(20_000)}`,
      });
    }
    if (!types.has('object')) {
      out.push({
        kind: 'deep-nesting',
        path,
        replacement: null,
        raw: `${'{"a":'.repeat(5_000)}1${'}'.repeat(5_000)}`,
      });
    }
  }
  const type = Array.isArray(schema.type) ? undefined : (schema.type as string | undefined);
  if (type === 'number' || type === 'integer') {
    const b = bounds(schema);
    if (typeof schema.maximum === 'number')
      out.push({
        kind: 'out-of-range',
        path,
        replacement:
          schema.maximum +
          (type === 'integer' ? 1 : Math.max(1e-9, Math.abs(schema.maximum) * 1e-6)),
      });
    if (typeof schema.exclusiveMaximum === 'number')
      out.push({ kind: 'out-of-range', path, replacement: schema.exclusiveMaximum });
    if (typeof schema.minimum === 'number')
      out.push({ kind: 'out-of-range', path, replacement: schema.minimum - 1 });
    if (typeof schema.exclusiveMinimum === 'number')
      out.push({ kind: 'out-of-range', path, replacement: schema.exclusiveMinimum });
    out.push({ kind: 'out-of-range', path, replacement: b.max > 1e300 ? -1e308 : 1e308 });
    if (type === 'integer')
      out.push({
        kind: 'not-integer',
        path,
        replacement: Math.min(b.max, Math.max(b.min, 1)) - 0.5,
      });
  }
  if (schema.const !== undefined || Array.isArray(schema.enum)) {
    out.push({ kind: 'bad-enum', path, replacement: 'no-such-choice\u202e' });
    out.push({ kind: 'bad-enum', path, replacement: '' });
  }
  if (type === 'string' && schema.const === undefined && !Array.isArray(schema.enum)) {
    const maxLength = schema.maxLength as number | undefined;
    const minLength = schema.minLength as number | undefined;
    if (maxLength !== undefined) {
      out.push({ kind: 'too-long', path, replacement: 'x'.repeat(maxLength + 1) });
      out.push({
        kind: 'too-long',
        path,
        replacement: '🔥'.repeat(Math.min(200_000, maxLength * 50 + 1)),
      });
    }
    if (minLength !== undefined && minLength > 0)
      out.push({ kind: 'too-short', path, replacement: '' });
    if (schema.format === 'uuid')
      out.push({ kind: 'bad-format', path, replacement: '../../etc/passwd' });
    if (schema.format === 'email')
      out.push({ kind: 'bad-format', path, replacement: 'no-at-sign.example' });
    if (typeof schema.pattern === 'string')
      out.push({ kind: 'bad-pattern', path, replacement: '9 not/allowed' });
  }
  if (type === 'array' && typeof schema.maxItems === 'number') {
    const items = tools.resolve(schema.items as Schema);
    const filler =
      items.type === 'integer' || items.type === 'number'
        ? ((items.minimum as number | undefined) ?? 0.5)
        : 'x';
    out.push({
      kind: 'huge-array',
      path,
      replacement: Array.from({ length: Math.max(100_000, schema.maxItems + 1) }, () => filler),
    });
  }
  if (type === 'object' && schema.additionalProperties === false) {
    out.push({ kind: 'unknown-property', path: [...path, 'unexpectedFieldÅ'], replacement: 1 });
  }
  return out;
}

/** Applies a mutation to a deep copy of `value`; returns the JSON text to send. */
export function applyMutation(value: unknown, mutation: Mutation): string {
  const PLACEHOLDER = '"__pulsewright_raw__"';
  if (mutation.path.length === 0) {
    if (mutation.raw !== undefined) return mutation.raw;
    return JSON.stringify(mutation.replacement === DELETE ? {} : mutation.replacement);
  }
  const copy = structuredClone(value) as Record<string | number, unknown>;
  let node: Record<string | number, unknown> = copy;
  for (const segment of mutation.path.slice(0, -1))
    node = node[segment] as Record<string | number, unknown>;
  const key = mutation.path[mutation.path.length - 1] as string | number;
  if (mutation.replacement === DELETE) delete node[key];
  else node[key] = mutation.raw !== undefined ? '__pulsewright_raw__' : mutation.replacement;
  const text = JSON.stringify(copy);
  return mutation.raw !== undefined ? text.replace(PLACEHOLDER, mutation.raw) : text;
}
