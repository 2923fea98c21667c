import type { INestApplication } from '@nestjs/common';
import helmet from 'helmet';
import { readAppConfig, trustProxySetting } from './config/app-config';
import { bodyParsers } from './core/body-parsers';
import { answerMiddlewareError } from './core/filters/api-exception.filter';

export { trustProxySetting };

/** Settings shared by the server and the tests' app. */
export function configureApp(app: INestApplication): void {
  app.setGlobalPrefix('api');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          styleSrc: ["'self'", "'unsafe-inline'"],
          scriptSrc: ["'self'"],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          upgradeInsecureRequests: null,
        },
      },
    }),
  );
  // the body parsers, then at once the answer to a body they refuse (400, 413 or 415 naming the part at fault):
  // an error passed further on would reach the front end's static files, which answer anything under /api with 404
  for (const parser of bodyParsers()) app.use(parser);
  app.use(answerMiddlewareError);
  // the client address (sign-in limits) comes from X-Forwarded-For only when a proxy is configured: TRUST_PROXY
  // names it (e.g. "loopback", "10.0.0.0/8" or a hop count); without it the header is ignored
  app.getHttpAdapter().getInstance().set('trust proxy', readAppConfig().trustProxy);
  app.enableShutdownHooks();
}
