import { readFileSync } from 'node:fs';
import { parse } from 'yaml';

/** The parts of an OpenAPI 3.1 document the service reads itself. */
export interface OpenApiDocument {
  openapi: string;
  info: { title: string; version: string };
  paths: Record<string, Record<string, unknown>>;
  components: { schemas: Record<string, JsonSchema> } & Record<string, unknown>;
}

/** A JSON Schema node as it appears in the document (possibly a `$ref`). */
export type JsonSchema = Record<string, unknown>;

export type RoleRequirement = 'public' | 'viewer' | 'engineer' | 'admin';

/** One operation of the document, with the lowest role that may call it. */
export interface OperationInfo {
  method: string;
  path: string;
  operationId: string;
  role: RoleRequirement;
  operation: Record<string, unknown>;
}

const HTTP_METHODS = ['get', 'put', 'post', 'delete', 'patch', 'head', 'options'];
const ROLE_REQUIREMENTS: readonly string[] = ['public', 'viewer', 'engineer', 'admin'];

/** Where the document lives: apps/api/openapi.yaml (one level above src/ and dist/). */
export const openApiPath = new URL('../openapi.yaml', import.meta.url);

/**
 * Reads and parses apps/api/openapi.yaml (or another document at `path`, for tests), every name
 * in it held as a one-byte string.
 *
 * Why: the file's descriptions hold characters beyond Latin-1 (−, ≤, Ω, …), so its text read as
 * UTF-8 is a two-byte string in V8, and so is every name the YAML parser cuts from it. V8 keeps
 * one copy of each property name, the first one made; the document is parsed before most of the
 * library's code is compiled, so a result object that the library builds later with a name the
 * document also holds (`spectrumThd`, say) gets the two-byte copy, and `JSON.stringify` then
 * builds the whole answer two-byte: a spectrum's 60 kB of ASCII as 120 kB, which Node measures and
 * converts to UTF-8 again on every answer (docs/robustness.md, throughput, sixth pass).
 *
 * How: the bytes are read as Latin-1 (one character a byte, a one-byte string), parsed, and each
 * string holding a byte above 0x7F (descriptions only; every name in the document is ASCII) is
 * decoded again as the UTF-8 it is. The result equals the document parsed from its UTF-8 text
 * (openapi.test.ts).
 */
export function loadOpenApiDocument(path: URL | string = openApiPath): OpenApiDocument {
  const latin1 = parse(readFileSync(path).toString('latin1')) as unknown;
  return decodeUtf8Strings(latin1) as OpenApiDocument;
}

/** Bytes above 0x7F in a string read as Latin-1: a UTF-8 sequence to decode. */
const BEYOND_ASCII = /[\x80-\xff]/;
/** Characters no byte read as Latin-1 gives: only a YAML escape makes them. */
const BEYOND_LATIN1 = /[\u0100-\uffff]/;

/**
 * The parsed YAML value (objects, arrays, strings, numbers, booleans, null) with each string
 * that holds Latin-1 characters above 0x7F decoded from the UTF-8 bytes they are; objects and
 * arrays are changed in place. Names are left as they are (all ASCII in this document).
 */
function decodeUtf8Strings(value: unknown): unknown {
  if (typeof value === 'string') {
    if (!BEYOND_ASCII.test(value)) return value;
    // A YAML escape (\u2212) gives a character beyond Latin-1 that the bytes cannot hold.
    if (BEYOND_LATIN1.test(value))
      throw new Error(
        `openapi.yaml: "${value.slice(0, 40)}…" mixes escapes beyond Latin-1 with UTF-8 characters; write them one way`,
      );
    return Buffer.from(value, 'latin1').toString('utf8');
  }
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) value[i] = decodeUtf8Strings(value[i]);
  } else if (value && typeof value === 'object') {
    const record = value as Record<string, unknown>;
    for (const key of Object.keys(record)) record[key] = decodeUtf8Strings(record[key]);
  }
  return value;
}

/**
 * Every operation with its `x-pulsewright-role`. Throws when an operation has none, so a
 * route can never be added without deciding who may call it.
 */
export function listOperations(document: OpenApiDocument): OperationInfo[] {
  const result: OperationInfo[] = [];
  for (const [path, item] of Object.entries(document.paths)) {
    for (const method of HTTP_METHODS) {
      const operation = item[method] as Record<string, unknown> | undefined;
      if (!operation) continue;
      const role = operation['x-pulsewright-role'];
      if (typeof role !== 'string' || !ROLE_REQUIREMENTS.includes(role)) {
        throw new Error(`${method.toUpperCase()} ${path} has no valid x-pulsewright-role`);
      }
      const isPublic = Array.isArray(operation.security) && operation.security.length === 0;
      if ((role === 'public') !== isPublic) {
        throw new Error(
          `${method.toUpperCase()} ${path}: x-pulsewright-role and security disagree`,
        );
      }
      result.push({
        method,
        path,
        operationId: String(operation.operationId),
        role: role as RoleRequirement,
        operation,
      });
    }
  }
  return result;
}

/** Follows `#/...` references inside the document. */
export function resolveRef(
  document: OpenApiDocument,
  schema: JsonSchema | undefined,
): JsonSchema | undefined {
  let current = schema;
  for (let depth = 0; current && typeof current.$ref === 'string' && depth < 20; depth++) {
    const pointer = current.$ref.replace(/^#\//, '').split('/');
    let target: unknown = document;
    for (const part of pointer) target = (target as Record<string, unknown> | undefined)?.[part];
    current = target as JsonSchema | undefined;
  }
  return current;
}
