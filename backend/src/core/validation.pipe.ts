import { ValidationError, ValidationPipe, type ArgumentMetadata } from '@nestjs/common';
import type { FieldError } from '@amberline/common';
import { AppException } from './app-exception';
import { unsafeInput } from './unsafe-input';
import { NOT_NULL } from './validators';

function flatten(errors: ValidationError[], prefix = ''): FieldError[] {
  const out: FieldError[] = [];
  for (const e of errors) {
    const field = !prefix ? e.property : /^\d+$/.test(e.property) ? `${prefix}[${e.property}]` : `${prefix}.${e.property}`;
    // a null where a value is required is one problem, not one per check of the missing value
    const constraints = e.constraints?.[NOT_NULL] ? { [NOT_NULL]: e.constraints[NOT_NULL] } : e.constraints;
    for (const reason of Object.values(constraints ?? {})) out.push({ field, reason });
    if (e.children?.length) out.push(...flatten(e.children, field));
  }
  return out;
}

const failed = (details: FieldError[]) => {
  const message = details.map((d) => (d.reason.startsWith(d.field) ? d.reason : `${d.field}: ${d.reason}`)).join('; ');
  return new AppException(400, 'validation_failed', message || 'Invalid request', details);
};

/**
 * Global validation: unknown fields rejected, types transformed, every problem named by field. Before any of that,
 * every body, query and path parameter is checked for what must never reach a validator or the database (see
 * unsafeInput): whatever the route and whether or not it has a DTO.
 */
class ApiValidationPipe extends ValidationPipe {
  override async transform(value: unknown, metadata: ArgumentMetadata): Promise<unknown> {
    if (metadata.type === 'body' || metadata.type === 'query' || metadata.type === 'param') {
      const problems = unsafeInput(value, metadata.data ?? '');
      if (problems.length) throw failed(problems);
    }
    // a list (or nothing) where the route takes an object would otherwise be read as an object with no fields
    const takesObject = metadata.type === 'body' && typeof metadata.metatype === 'function' && metadata.metatype !== Object && metadata.data === undefined;
    if (takesObject && (value === null || typeof value !== 'object' || Array.isArray(value))) throw failed([{ field: 'body', reason: 'must be a JSON object' }]);
    return super.transform(value, metadata);
  }
}

export function createValidationPipe(): ValidationPipe {
  return new ApiValidationPipe({
    whitelist: true,
    forbidNonWhitelisted: true,
    transform: true,
    stopAtFirstError: false,
    exceptionFactory: (errors) => failed(flatten(errors)),
  });
}
