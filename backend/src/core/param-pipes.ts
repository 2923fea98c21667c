import { Injectable, type ArgumentMetadata, type PipeTransform } from '@nestjs/common';
import { isUUID } from 'class-validator';
import { fieldError } from './app-exception';

/**
 * A path or query parameter that must be a UUID, refused with 400 naming the parameter (`id: must be a UUID`) —
 * Nest's ParseUUIDPipe answers "Validation failed (uuid is expected)" without saying which parameter.
 */
@Injectable()
export class UuidParam implements PipeTransform<string, string> {
  transform(value: string, meta: ArgumentMetadata): string {
    if (typeof value !== 'string' || !isUUID(value)) throw fieldError(meta.data ?? 'id', 'must be a UUID');
    return value;
  }
}

/** An optional whole-number parameter (e.g. `?version=3`): absent stays undefined, anything else is refused by name. */
@Injectable()
export class OptionalIntParam implements PipeTransform<string | undefined, number | undefined> {
  transform(value: string | undefined, meta: ArgumentMetadata): number | undefined {
    if (value === undefined || value === '') return undefined;
    const n = typeof value === 'string' && /^-?\d{1,9}$/.test(value) ? Number(value) : NaN;
    if (!Number.isSafeInteger(n) || n < 1) throw fieldError(meta.data ?? 'value', 'must be a whole number of at least 1');
    return n;
  }
}
