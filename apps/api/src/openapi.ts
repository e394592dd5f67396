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

/** Reads and parses apps/api/openapi.yaml. */
export function loadOpenApiDocument(): OpenApiDocument {
  return parse(readFileSync(openApiPath, 'utf8')) as OpenApiDocument;
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
