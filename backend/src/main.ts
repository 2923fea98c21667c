import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { NestExpressApplication } from '@nestjs/platform-express';
import { SwaggerModule } from '@nestjs/swagger';
import { AppModule } from './app.module';
import { configureApp } from './configure-app';
import { environment } from './config/app-config';
import { validateEnv } from './config/env.validation';
import { buildOpenApiDocument } from './openapi';

async function bootstrap(): Promise<void> {
  let env;
  try {
    env = validateEnv(environment());
  } catch (err) {
    console.error((err as Error).message);
    process.exit(1);
  }
  const app = await NestFactory.create<NestExpressApplication>(AppModule, { rawBody: true, bufferLogs: false });
  configureApp(app);
  const doc = buildOpenApiDocument(app);
  SwaggerModule.setup('api/docs', app, doc);
  await app.listen(env.PORT, env.HOST);
  Logger.log(`Amberline listening on http://${env.HOST}:${env.PORT}`, 'Bootstrap');
}
void bootstrap();
