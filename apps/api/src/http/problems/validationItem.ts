import type { Request } from 'express';
import type { JsonSchema, OpenApiDocument } from '../../openapi.js';
import { describeAllowed, describeValue, schemaAt } from '../describeSchema.js';
import type { ProblemItem } from '../errors.js';
import type { ValidatorItem } from './validatorError.js';

/** Turns `/body/modulation/ma` + "must be <= 4" into `modulation.ma must be a number > 0 and ≤ 4; got 5`. */
export function validationItem(
  document: OpenApiDocument,
  req: Request,
  item: ValidatorItem,
): ProblemItem {
  const parts = (item.path ?? '').split('/').filter(Boolean);
  const location = parts[0] ?? '';
  const segments = parts.slice(1);
  const code = (item.errorCode ?? '').replace('.openapi.validation', '');
  if (code === 'discriminator') {
    const union = locate(document, req, location, segments, true).schema;
    const tag =
      (union?.discriminator as { propertyName?: string } | undefined)?.propertyName ?? 'method';
    const mapping = Object.keys(
      (union?.discriminator as { mapping?: object } | undefined)?.mapping ?? {},
    );
    const field = [...segments, tag].join('.');
    const given = locate(document, req, location, [...segments, tag]).value;
    const message = `${field} must be one of ${mapping.map((v) => JSON.stringify(v)).join(', ') || 'the documented values'}; got ${describeValue(given)}`;
    return { path: field, message };
  }
  const field = segments.join('.') || location;
  const { schema, value } = locate(document, req, location, segments);
  const allowed = describeAllowed(document, schema);
  let message: string;
  if (code === 'required') {
    message = allowed ? `${field} is required; it must be ${allowed}` : `${field} is required`;
  } else if (code === 'additionalProperties') {
    const parent = locate(document, req, location, segments.slice(0, -1)).schema;
    const known = Object.keys((parent?.properties as object | undefined) ?? {});
    message = `${field} is not a known field${known.length ? `; allowed fields are ${known.join(', ')}` : ''}`;
  } else if (allowed) {
    message = `${field} must be ${allowed}; got ${describeValue(value)}`;
  } else {
    message = `${field} ${item.message ?? 'is not valid'}`;
  }
  return { path: field, message };
}

/** The schema and the value the request has at `location` (`body`, `query`, …) + `segments`. */
function locate(
  document: OpenApiDocument,
  req: Request,
  location: string,
  segments: readonly string[],
  keepChoices = false,
): { schema: JsonSchema | undefined; value: unknown } {
  const operation = operationOf(document, req);
  if (!operation) return { schema: undefined, value: undefined };
  if (location === 'body') {
    const content = (
      operation.requestBody as { content?: Record<string, { schema?: JsonSchema }> } | undefined
    )?.content;
    const root = content?.['application/json']?.schema ?? content?.['multipart/form-data']?.schema;
    let value: unknown = req.body;
    for (const segment of segments)
      value = (value as Record<string, unknown> | undefined)?.[segment];
    return { schema: schemaAt(document, root, segments, req.body, { keepChoices }), value };
  }
  const name = segments[0];
  const where = location === 'params' ? 'path' : location;
  const pathItem = document.paths[openApiRouteOf(req) ?? ''] ?? {};
  const parameters = [
    ...((pathItem.parameters as JsonSchema[] | undefined) ?? []),
    ...((operation.parameters as JsonSchema[] | undefined) ?? []),
  ].map((p) => (p.$ref ? (resolveParameter(document, p) ?? p) : p));
  const parameter = parameters.find((p) => p.name === name && p.in === where);
  const source =
    location === 'params' ? req.params : location === 'query' ? req.query : req.headers;
  return {
    schema: schemaAt(document, parameter?.schema as JsonSchema | undefined, [], undefined),
    value: (source as Record<string, unknown>)[name ?? ''],
  };
}

function resolveParameter(document: OpenApiDocument, ref: JsonSchema): JsonSchema | undefined {
  const pointer = String(ref.$ref).replace(/^#\//, '').split('/');
  let target: unknown = document;
  for (const part of pointer) target = (target as Record<string, unknown> | undefined)?.[part];
  return target as JsonSchema | undefined;
}

function openApiRouteOf(req: Request): string | undefined {
  return (req as Request & { openapi?: { openApiRoute?: string } }).openapi?.openApiRoute;
}

function operationOf(document: OpenApiDocument, req: Request): Record<string, unknown> | undefined {
  const route = openApiRouteOf(req);
  if (!route) return undefined;
  return document.paths[route]?.[req.method.toLowerCase()] as Record<string, unknown> | undefined;
}
