import type { INestApplication } from '@nestjs/common';
import helmet from 'helmet';

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
  // a reverse proxy on this machine may pass the client address along
  app.getHttpAdapter().getInstance().set('trust proxy', 'loopback');
  app.enableShutdownHooks();
}
