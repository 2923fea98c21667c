import type { INestApplication, Type } from '@nestjs/common';
import { ROUTE_ARGS_METADATA } from '@nestjs/common/constants';
import { RouteParamtypes } from '@nestjs/common/enums/route-paramtypes.enum';
import { ModulesContainer } from '@nestjs/core';
import { DocumentBuilder, SwaggerModule, type OpenAPIObject } from '@nestjs/swagger';
import type { ParameterObject, ReferenceObject, SchemaObject } from '@nestjs/swagger/dist/interfaces/open-api-spec.interface';
import type { MetadataStorage } from 'class-transformer/types/MetadataStorage';
import { ValidationTypes } from 'class-validator';
import { targetConstructorToSchema, validationMetadatasToSchemas } from 'class-validator-jsonschema';
import { OptionalIntParam, UuidParam } from './core/param-pipes';
import { NOT_NULL } from './core/validators';

// class-transformer's own record of `@Type(() => X)`, so nested DTOs become references to their schemas
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { defaultMetadataStorage } = require('class-transformer/cjs/storage') as { defaultMetadataStorage: MetadataStorage };

type Schema = SchemaObject | ReferenceObject;
type CustomMeta = { name?: string; constraints?: unknown[] };

/** Schemas of the project's own validators (`core/validators.ts`), by the name each registers. */
const CUSTOM: Record<string, (meta: CustomMeta) => SchemaObject> = {
  isCalendarDate: () => ({ type: 'string', format: 'date', description: 'a real calendar day, YYYY-MM-DD' }),
  isLocalDateTime: () => ({ type: 'string', pattern: '^\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}$', description: 'local wall-clock time, YYYY-MM-DDTHH:mm' }),
  isDateOrDateTime: () => ({ type: 'string', description: 'YYYY-MM-DD, or an ISO 8601 date-time with its offset' }),
  maxDecimals: () => ({ type: 'number', description: 'a plain decimal number (no exponent notation) with few decimals' }),
  [NOT_NULL]: () => ({ description: 'may be left out (the stored value stays) but not null' }),
};

/**
 * The JSON schema of every class the validation pipe checks, read from the class-validator decorators that do the
 * checking (so the description cannot drift from what is enforced), with references between them in
 * `#/components/schemas/`.
 */
export function validatedSchemas(): Record<string, SchemaObject> {
  return validationMetadatasToSchemas(schemaOptions()) as Record<string, SchemaObject>;
}

function schemaOptions(): Parameters<typeof validationMetadatasToSchemas>[0] {
  return {
    refPointerPrefix: '#/components/schemas/',
    classTransformerMetadataStorage: defaultMetadataStorage,
    additionalConverters: {
      [ValidationTypes.CUSTOM_VALIDATION]: (meta) => (CUSTOM[(meta as CustomMeta).name ?? '']?.(meta as CustomMeta) ?? {}) as never,
    },
  };
}

type RouteArg = { index: number; data?: unknown; pipes?: unknown[] };
/** What the validation decorators say of one route's arguments, beyond what Nest's explorer reads. */
type RouteArgs = { queryDto?: Type; bodyDto?: Type; namedQueries: ParameterObject[]; uuidParams: string[] };

/** Each controller method's arguments, by operation id `Controller_method`. */
function routeArgs(app: INestApplication): Map<string, RouteArgs> {
  const out = new Map<string, RouteArgs>();
  for (const mod of app.get(ModulesContainer).values()) {
    for (const wrapper of mod.controllers.values()) {
      const ctrl = wrapper.metatype as Type | null;
      if (!ctrl) continue;
      for (const method of Object.getOwnPropertyNames(ctrl.prototype)) {
        const args = (Reflect.getMetadata(ROUTE_ARGS_METADATA, ctrl, method) ?? {}) as Record<string, RouteArg>;
        const types = (Reflect.getMetadata('design:paramtypes', ctrl.prototype, method) ?? []) as Type[];
        const route: RouteArgs = { namedQueries: [], uuidParams: [] };
        for (const [key, arg] of Object.entries(args)) {
          const kind = Number(key.split(':')[0]);
          const type = types[arg.index];
          const pipes = arg.pipes ?? [];
          if (kind === RouteParamtypes.QUERY && arg.data === undefined && type && type !== Object) route.queryDto = type;
          if (kind === RouteParamtypes.BODY && arg.data === undefined && type && type !== Object) route.bodyDto = type;
          if (kind === RouteParamtypes.QUERY && typeof arg.data === 'string') {
            const schema: SchemaObject = pipes.includes(OptionalIntParam) ? { type: 'integer', minimum: 1 } : type === Number ? { type: 'number' } : { type: 'string' };
            route.namedQueries.push({ name: arg.data, in: 'query', required: false, schema });
          }
          if (kind === RouteParamtypes.PARAM && typeof arg.data === 'string' && pipes.includes(UuidParam)) route.uuidParams.push(arg.data);
        }
        out.set(`${ctrl.name}_${method}`, route);
      }
    }
  }
  return out;
}

/** Properties of a schema including those of the classes it extends (class-validator-jsonschema flattens them). */
function queryParameters(schema: SchemaObject | undefined): ParameterObject[] {
  if (!schema?.properties) return [];
  const required = new Set(schema.required ?? []);
  return Object.entries(schema.properties as Record<string, Schema>).map(([name, s]) => ({ name, in: 'query', required: required.has(name), schema: s }));
}

/**
 * The API description served at /api/docs: every request body and every query parameter with its schema, read from
 * the validation decorators of the DTOs (the routes are described by Nest's own explorer).
 */
export function buildOpenApiDocument(app: INestApplication): OpenAPIObject {
  const doc = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Amberline API')
      .setDescription('Oversize/overweight move desk. Request bodies and query parameters are described from the checks the server runs on them.')
      .setVersion('0.1.0')
      .addBearerAuth()
      .build(),
  );
  const schemas = validatedSchemas();
  const routes = routeArgs(app);
  // a DTO with no decorators of its own (`PreviewDto extends CreateMoveDto`) is described through the class it extends
  for (const route of routes.values()) {
    for (const dto of [route.bodyDto, route.queryDto]) {
      if (dto && !schemas[dto.name]?.properties) schemas[dto.name] = targetConstructorToSchema(dto, schemaOptions()) as SchemaObject;
    }
  }
  doc.components = { ...doc.components, schemas: { ...(doc.components?.schemas ?? {}), ...schemas } };
  for (const item of Object.values(doc.paths)) {
    for (const op of [item.get, item.put, item.post, item.patch, item.delete]) {
      const route = op?.operationId ? routes.get(op.operationId) : undefined;
      if (!op || !route) continue;
      const params = (op.parameters ?? []).filter((p): p is ParameterObject => 'name' in p);
      const named = new Set(params.map((p) => `${p.in}:${p.name}`));
      const extra = [...(route.queryDto ? queryParameters(schemas[route.queryDto.name]) : []), ...route.namedQueries].filter((p) => !named.has(`query:${p.name}`));
      // the explorer lists a whole-query DTO without decorators as nothing, or as one parameter named after the class
      const all = [...params.filter((p) => p.in !== 'query' || p.name !== route.queryDto?.name), ...extra];
      op.parameters = all;
      for (const p of all) if (p.in === 'path' && route.uuidParams.includes(p.name)) p.schema = { type: 'string', format: 'uuid' };
    }
  }
  return doc;
}
