import { ValidationError, ValidationPipe } from '@nestjs/common';
import type { FieldError } from '@amberline/common';
import { AppException } from './app-exception';

function flatten(errors: ValidationError[], prefix = ''): FieldError[] {
  const out: FieldError[] = [];
  for (const e of errors) {
    const field = !prefix ? e.property : /^\d+$/.test(e.property) ? `${prefix}[${e.property}]` : `${prefix}.${e.property}`;
    for (const reason of Object.values(e.constraints ?? {})) out.push({ field, reason });
    if (e.children?.length) out.push(...flatten(e.children, field));
  }
  return out;
}

/** Global validation: unknown fields rejected, types transformed, every problem named by field. */
export function createValidationPipe(): ValidationPipe {
  return new ValidationPipe({
    whitelist: true,
    forbidNonWhitelisted: true,
    transform: true,
    stopAtFirstError: false,
    exceptionFactory: (errors) => {
      const details = flatten(errors);
      const message = details.map((d) => (d.reason.startsWith(d.field) ? d.reason : `${d.field}: ${d.reason}`)).join('; ');
      return new AppException(400, 'validation_failed', message || 'Invalid request', details);
    },
  });
}
