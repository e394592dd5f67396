import { resolveRef, type JsonSchema, type OpenApiDocument } from '../openapi.js';

/**
 * Finds the schema that governs `segments` inside `root`, following $ref, allOf and
 * discriminated oneOf (choosing the branch that the request's own value selects).
 */
export function schemaAt(
  document: OpenApiDocument,
  root: JsonSchema | undefined,
  segments: readonly string[],
  value: unknown,
  { keepChoices = false }: { keepChoices?: boolean } = {},
): JsonSchema | undefined {
  let raw = resolveRef(document, root);
  let schema = flatten(document, root, value);
  let current = value;
  for (const segment of segments) {
    if (!schema) return undefined;
    const properties = schema.properties as Record<string, JsonSchema> | undefined;
    if (properties && segment in properties) {
      raw = properties[segment];
    } else if (schema.items && /^\d+$/.test(segment)) {
      raw = schema.items as JsonSchema;
    } else {
      return undefined;
    }
    current = (current as Record<string, unknown> | undefined)?.[segment];
    schema = flatten(document, raw, current);
  }
  // With keepChoices the oneOf itself is returned, to list its discriminator values.
  return keepChoices ? resolveRef(document, raw) : schema;
}

function flatten(
  document: OpenApiDocument,
  input: JsonSchema | undefined,
  value: unknown,
): JsonSchema | undefined {
  let schema = resolveRef(document, input);
  if (!schema) return undefined;
  if (Array.isArray(schema.allOf)) {
    const merged: JsonSchema = { ...schema, properties: {} };
    delete merged.allOf;
    for (const part of schema.allOf as JsonSchema[]) {
      const flat = flatten(document, part, value);
      if (!flat) continue;
      Object.assign(merged.properties as object, flat.properties ?? {});
      for (const key of Object.keys(flat))
        if (key !== 'properties' && !(key in merged)) merged[key] = flat[key];
    }
    schema = merged;
  }
  const choices = (schema.oneOf ?? schema.anyOf) as JsonSchema[] | undefined;
  if (Array.isArray(choices)) {
    const branches = choices
      .map((choice) => resolveRef(document, choice))
      .filter((b): b is JsonSchema => !!b);
    const tag = (schema.discriminator as { propertyName?: string } | undefined)?.propertyName;
    const given = tag ? (value as Record<string, unknown> | undefined)?.[tag] : undefined;
    const picked =
      (tag &&
        branches.find(
          (b) => (b.properties as Record<string, JsonSchema> | undefined)?.[tag]?.const === given,
        )) ||
      branches.find((b) => b.type !== 'null');
    if (picked) return flatten(document, picked, value);
  }
  return schema;
}

/** The allowed values of a schema in words, e.g. `a number > 0 and ≤ 4`. */
export function describeAllowed(
  document: OpenApiDocument,
  schema: JsonSchema | undefined,
): string | undefined {
  if (!schema) return undefined;
  if (schema.const !== undefined) return JSON.stringify(schema.const);
  if (Array.isArray(schema.enum))
    return `one of ${(schema.enum as unknown[]).map((v) => JSON.stringify(v)).join(', ')}`;
  if (Array.isArray(schema.oneOf) && schema.discriminator) {
    const tag = (schema.discriminator as { propertyName: string }).propertyName;
    const values = (schema.oneOf as JsonSchema[])
      .map(
        (b) =>
          (resolveRef(document, b)?.properties as Record<string, JsonSchema> | undefined)?.[tag]
            ?.const,
      )
      .filter((v) => v !== undefined);
    return `an object whose ${tag} is one of ${values.map((v) => JSON.stringify(v)).join(', ')}`;
  }
  const type = Array.isArray(schema.type)
    ? (schema.type as string[]).filter((t) => t !== 'null')[0]
    : schema.type;
  if (type === 'integer' || type === 'number') {
    const bounds: string[] = [];
    if (typeof schema.exclusiveMinimum === 'number') bounds.push(`> ${schema.exclusiveMinimum}`);
    if (typeof schema.minimum === 'number') bounds.push(`≥ ${schema.minimum}`);
    if (typeof schema.exclusiveMaximum === 'number') bounds.push(`< ${schema.exclusiveMaximum}`);
    if (typeof schema.maximum === 'number') bounds.push(`≤ ${schema.maximum}`);
    const noun = type === 'integer' ? 'an integer' : 'a number';
    return bounds.length ? `${noun} ${bounds.join(' and ')}` : noun;
  }
  if (type === 'string') {
    if (schema.format === 'email') return 'an e-mail address';
    if (schema.format === 'uuid') return 'a UUID';
    if (schema.format === 'date-time') return 'a date-time (RFC 3339)';
    if (schema.format === 'binary') return 'a file';
    const min = typeof schema.minLength === 'number' ? schema.minLength : 0;
    const max = typeof schema.maxLength === 'number' ? schema.maxLength : undefined;
    if (max !== undefined) return `text of ${min} to ${max} characters`;
    return min > 0 ? `text of at least ${min} characters` : 'text';
  }
  if (type === 'array') {
    const parts = ['a list'];
    if (typeof schema.minItems === 'number') parts.push(`of at least ${schema.minItems} items`);
    if (typeof schema.maxItems === 'number')
      parts.push(`${parts.length > 1 ? 'and' : 'of'} at most ${schema.maxItems} items`);
    return parts.join(' ');
  }
  if (type === 'boolean') return 'true or false';
  if (type === 'object') {
    const properties = Object.keys((schema.properties as object | undefined) ?? {});
    return properties.length ? `an object with fields ${properties.join(', ')}` : 'an object';
  }
  return undefined;
}

/** The value as the errors of the library describe it (same words as ParameterRangeError). */
export function describeValue(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string')
    return JSON.stringify(value.length > 60 ? `${value.slice(0, 57)}...` : value);
  if (Array.isArray(value)) return `an array of length ${value.length}`;
  if (value === null) return 'null';
  if (value === undefined) return 'nothing';
  return typeof value;
}
