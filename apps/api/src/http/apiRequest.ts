/**
 * Request types of the routes, taken from the OpenAPI document (apps/api/openapi.yaml) through
 * the types openapi-typescript generates for the client package (`operations`, by operationId).
 * The OpenAPI validator has checked body and query against the same document before a handler
 * runs, so a handler typed `ApiRequest<'createStudy'>` reads `req.body` as the document's
 * StudyCreate, and a change of the document that a route does not follow breaks the build.
 */
import type { operations } from '@pulsewright/client';
import type { Request } from 'express';

/** An operationId of the document. */
export type OperationId = keyof operations;

/** The body of operation `Id` (JSON, or the fields of a multipart form); undefined when it has none. */
export type RequestBody<Id extends OperationId> = operations[Id] extends {
  requestBody: { content: infer Content };
}
  ? Content[keyof Content]
  : operations[Id] extends { requestBody?: { content: infer Content } }
    ? Content[keyof Content] | undefined
    : undefined;

/**
 * `Body` with the fields `Defaulted` present: fields the document gives a `default`, which the
 * validator fills in before the handler runs (the generated types leave them optional).
 */
type WithDefaults<Body, Defaulted extends PropertyKey> = [Defaulted] extends [never]
  ? Body
  : Body & { [Name in Defaulted & keyof Body]-?: Exclude<Body[Name], undefined> };

/** The query parameters of operation `Id` as the document declares them. */
export type QueryOf<Id extends OperationId> = OrNone<operations[Id]['parameters']['query']>;

/** The path parameters of operation `Id` (strings, as Express reads them). */
export type ParamsOf<Id extends OperationId> = {
  [Name in keyof OrNone<operations[Id]['parameters']['path']>]: string;
};

/** `Part` without undefined, or an object with no keys when the operation has none. */
type OrNone<Part> = [NonNullable<Part>] extends [never] ? Record<string, never> : NonNullable<Part>;

/**
 * An Express request whose body, query and path parameters are those of operation `Id`;
 * `Defaulted` names the body fields whose default the document states (present in the handler).
 */
export type ApiRequest<
  Id extends OperationId,
  Defaulted extends keyof NonNullable<RequestBody<Id>> = never,
> = Request<ParamsOf<Id>, unknown, WithDefaults<RequestBody<Id>, Defaulted>, QueryOf<Id>>;
