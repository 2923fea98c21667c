import { SetMetadata } from '@nestjs/common';

export const IS_PUBLIC_KEY = 'isPublic';
/** Opens a handler to callers without a token. Everything else needs a signed-in user. */
export const Public = () => SetMetadata(IS_PUBLIC_KEY, true);
